using System.Security.Cryptography;
using System.Text;

namespace CdsNatremia.Audit.Pseudonyms;

/// <summary>
/// Turns a patient id into a keyed pseudonym: HMAC-SHA256(key, UTF-8 patient id) as lowercase hex. The same patient
/// gets the same pseudonym under one key (so records can be grouped), and without the key the pseudonym cannot be
/// traced back by hashing candidate ids. Thread-safe.
/// </summary>
public sealed class PatientPseudonymizer
{
    private readonly byte[] _key;

    /// <summary>Creates the pseudonymizer with a secret key of at least 32 bytes.</summary>
    public PatientPseudonymizer(byte[] key)
    {
        ArgumentNullException.ThrowIfNull(key);
        if (key.Length < 32)
        {
            throw new ArgumentException("The pseudonym key must be at least 32 bytes.", nameof(key));
        }

        _key = (byte[])key.Clone();
    }

    /// <summary>The pseudonym of a patient id.</summary>
    public string Pseudonym(string patientId)
    {
        ArgumentException.ThrowIfNullOrEmpty(patientId);
        return Convert.ToHexStringLower(HMACSHA256.HashData(_key, Encoding.UTF8.GetBytes(patientId)));
    }
}
