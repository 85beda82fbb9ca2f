using System.Security.Cryptography;
using System.Text;

namespace CdsNatremia.Audit.Pseudonyms;

/// <summary>
/// Where the pseudonym key comes from: the configured <see cref="AuditOptions.PseudonymKey"/>; in Development only,
/// when none is configured, a random 32-byte key generated once and kept in <c>{data folder}/pseudonym.key</c> (owner
/// read/write only). Outside Development a missing key stops start-up: a key that lived only in one machine's data
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
                : throw new InvalidOperationException("Natremia:Audit:PseudonymKey must be at least 32 characters long.");
        }

        if (!isDevelopment)
        {
            throw new InvalidOperationException(
                "Natremia:Audit:PseudonymKey is not configured. Outside Development the patient pseudonym key must be "
                + "configured (at least 32 random characters, kept secret and the same on every instance); see docs/audit.md.");
        }

        Directory.CreateDirectory(dataDirectory);
        var path = Path.Combine(dataDirectory, DevelopmentKeyFile);
        if (File.Exists(path))
        {
            return Convert.FromBase64String(File.ReadAllText(path).Trim());
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
            return Convert.FromBase64String(File.ReadAllText(path).Trim());
        }

        return key;
    }
}
