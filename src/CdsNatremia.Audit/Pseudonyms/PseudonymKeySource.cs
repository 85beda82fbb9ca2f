using System.Security.Cryptography;
using System.Text;
using CdsNatremia.Audit.Storage;

namespace CdsNatremia.Audit.Pseudonyms;

/// <summary>
/// Where the pseudonym key comes from: the configured <see cref="AuditOptions.PseudonymKey"/>; in Development only,
/// when none is configured, a random 32-byte key generated once and kept in <c>{data folder}/pseudonym.key</c> (owner
/// read/write only, in a folder only the owner may enter). Outside Development a missing key stops start-up: a key that lived only in one machine's data
/// folder would make pseudonyms differ between instances and vanish with the machine.
/// </summary>
public static class PseudonymKeySource
{
    /// <summary>The file name of the generated development key.</summary>
    public const string DevelopmentKeyFile = "pseudonym.key";

    /// <summary>Resolves the key bytes.</summary>
    /// <param name="configured">The configured key, or null.</param>
    /// <param name="isDevelopment">True in the Development environment.</param>
    /// <param name="dataDirectory">The (absolute) data folder.</param>
    public static byte[] Resolve(string? configured, bool isDevelopment, string dataDirectory)
    {
        if (!string.IsNullOrWhiteSpace(configured))
        {
            var bytes = Encoding.UTF8.GetBytes(configured);
            return bytes.Length >= 32
                ? bytes
                : throw new AuditConfigurationException("Natremia:Audit:PseudonymKey must be at least 32 characters long: set it to at least 32 random characters (see docs/audit.md).");
        }

        if (!isDevelopment)
        {
            throw new AuditConfigurationException(
                "Natremia:Audit:PseudonymKey is not configured. Outside Development the patient pseudonym key must be "
                + "configured (at least 32 random characters, kept secret and the same on every instance); see docs/audit.md.");
        }

        PrivateFiles.EnsureFolder(dataDirectory);
        var path = Path.Combine(dataDirectory, DevelopmentKeyFile);
        if (File.Exists(path))
        {
            PrivateFiles.RestrictFile(path);
            return ReadKeyFile(path);
        }

        var key = RandomNumberGenerator.GetBytes(32);
        var options = new FileStreamOptions { Mode = FileMode.CreateNew, Access = FileAccess.Write };
        if (!OperatingSystem.IsWindows())
        {
            options.UnixCreateMode = UnixFileMode.UserRead | UnixFileMode.UserWrite;
        }

        try
        {
            using var stream = new FileStream(path, options);
            using var writer = new StreamWriter(stream);
            writer.Write(Convert.ToBase64String(key));
        }
        catch (IOException) when (File.Exists(path))
        {
            // Another process created it first: use theirs, so both agree.
            return ReadKeyFile(path);
        }

        return key;
    }

    /// <summary>
    /// The keys used before a rotation (<see cref="AuditOptions.PreviousPseudonymKeys"/>), each at least 32 characters.
    /// They make no new pseudonym; they let a look-up find one patient's records made under an older key.
    /// </summary>
    public static IReadOnlyList<byte[]> ResolvePrevious(IEnumerable<string>? configured)
    {
        var keys = new List<byte[]>();
        var index = 0;
        foreach (var text in configured ?? [])
        {
            var bytes = Encoding.UTF8.GetBytes(text ?? string.Empty);
            if (bytes.Length < 32)
            {
                throw new AuditConfigurationException(
                    $"Natremia:Audit:PreviousPseudonymKeys:{index} must be at least 32 characters long: list the former PseudonymKey exactly as it was (see docs/audit.md, key rotation).");
            }

            keys.Add(bytes);
            index++;
        }

        return keys;
    }

    private static byte[] ReadKeyFile(string path)
    {
        try
        {
            var key = Convert.FromBase64String(File.ReadAllText(path).Trim());
            return key.Length >= 32
                ? key
                : throw new AuditConfigurationException($"The pseudonym key file {path} holds fewer than 32 bytes: delete it to have a new key generated, or configure Natremia:Audit:PseudonymKey.");
        }
        catch (FormatException ex)
        {
            throw new AuditConfigurationException($"The pseudonym key file {path} is not base64: delete it to have a new key generated, or configure Natremia:Audit:PseudonymKey.", ex);
        }
    }
}
