using System.Security.Cryptography;
using System.Text;

namespace CdsNatremia.Audit.Pseudonyms;

/// <summary>
/// Turns a patient id into a keyed pseudonym: HMAC-SHA256(key, UTF-8 patient id) as lowercase hex. The same patient
/// gets the same pseudonym under one key (so records can be grouped), and without the key the pseudonym cannot be
/// traced back by hashing candidate ids. Every pseudonym is stored with the <see cref="KeyId"/> of the key that made
/// it; after a key rotation the previous keys are kept (for look-ups only), so one patient's records made under the
/// old and the new key can still be found together (<see cref="AllPseudonyms"/>). Thread-safe.
/// </summary>
public sealed class PatientPseudonymizer
{
    private readonly byte[] _key;
    private readonly IReadOnlyList<(string KeyId, byte[] Key)> _previous;

    /// <summary>Creates the pseudonymizer with a secret key of at least 32 bytes and, after rotations, the keys used before.</summary>
    public PatientPseudonymizer(byte[] key, IEnumerable<byte[]>? previousKeys = null)
    {
        ArgumentNullException.ThrowIfNull(key);
        if (key.Length < 32)
        {
            throw new ArgumentException("The pseudonym key must be at least 32 bytes.", nameof(key));
        }

        _key = (byte[])key.Clone();
        KeyId = KeyIdOf(_key);
        _previous = (previousKeys ?? [])
            .Select(k => (byte[])k.Clone())
            .Where(k => k.Length >= 32 ? true : throw new ArgumentException("Every previous pseudonym key must be at least 32 bytes.", nameof(previousKeys)))
            .Select(k => (KeyIdOf(k), k))
            .Where(k => k.Item1 != KeyId)
            .DistinctBy(k => k.Item1)
            .ToList();
    }

    /// <summary>
    /// Identifies the current key without revealing it: the first 12 hex characters of SHA-256 over a fixed label and
    /// the key. Stored beside every pseudonym, so a record says which key made it.
    /// </summary>
    public string KeyId { get; }

    /// <summary>The ids of the previous keys still kept for look-ups, newest configured first.</summary>
    public IReadOnlyList<string> PreviousKeyIds => _previous.Select(p => p.KeyId).ToList();

    /// <summary>The key id of a key (see <see cref="KeyId"/>).</summary>
    public static string KeyIdOf(byte[] key)
    {
        ArgumentNullException.ThrowIfNull(key);
        var label = Encoding.UTF8.GetBytes("cdsnatremia pseudonym key id\n");
        return Convert.ToHexStringLower(SHA256.HashData([.. label, .. key]))[..12];
    }

    /// <summary>The pseudonym of a patient id under the current key.</summary>
    public string Pseudonym(string patientId)
    {
        ArgumentException.ThrowIfNullOrEmpty(patientId);
        return Compute(_key, patientId);
    }

    /// <summary>
    /// The patient's pseudonym under the current key and every previous key, each with its key id: what a look-up of
    /// one patient's records searches for across a rotation.
    /// </summary>
    public IReadOnlyList<KeyedPseudonym> AllPseudonyms(string patientId)
    {
        ArgumentException.ThrowIfNullOrEmpty(patientId);
        return [new KeyedPseudonym(KeyId, Compute(_key, patientId)), .. _previous.Select(p => new KeyedPseudonym(p.KeyId, Compute(p.Key, patientId)))];
    }

    private static string Compute(byte[] key, string patientId)
        => Convert.ToHexStringLower(HMACSHA256.HashData(key, Encoding.UTF8.GetBytes(patientId)));
}

/// <summary>A pseudonym with the id of the key that made it.</summary>
/// <param name="KeyId">The key id (<see cref="PatientPseudonymizer.KeyId"/>).</param>
/// <param name="Pseudonym">The pseudonym (64 lowercase hex characters).</param>
public sealed record KeyedPseudonym(string KeyId, string Pseudonym);
