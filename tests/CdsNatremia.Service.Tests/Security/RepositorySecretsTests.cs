using System.Diagnostics;
using System.Text.RegularExpressions;

namespace CdsNatremia.Service.Tests.Security;

/// <summary>
/// Nothing secret is tracked in git: no file under any <c>data/</c> folder (the audit database and the generated
/// pseudonym key live there), and nothing that looks like a key except the documented test-only examples, whose
/// names contain "test-only" (docs/security.md). Reads <c>git ls-files</c> from the repository root.
/// </summary>
public sealed partial class RepositorySecretsTests
{
    private static readonly string[] KeyExtensions = [".key", ".pem", ".p12", ".pfx", ".jks", ".keystore", ".der", ".p8", ".ppk", ".gpg", ".asc"];

    private static readonly string[] KeyFileNames = ["id_rsa", "id_ecdsa", "id_ed25519", "id_dsa", "pseudonym.key"];

    [SkippableFact]
    public void TrackedFiles_UnderADataFolder_None()
    {
        var tracked = TrackedFiles(out var root);

        var underData = tracked.Where(f => f.Split('/').SkipLast(1).Any(segment => segment.Equals("data", StringComparison.OrdinalIgnoreCase))).ToList();

        Assert.True(underData.Count == 0, $"Files under a data/ folder are tracked in git (remove them with git rm --cached; data/ is ignored): {string.Join(", ", underData)} (repository {root})");
    }

    [SkippableFact]
    public void TrackedFiles_ThatLookLikeKeys_OnlyTestOnlyExamples()
    {
        var tracked = TrackedFiles(out var root);

        var keyLike = tracked
            .Where(f => !Path.GetFileName(f).Contains("test-only", StringComparison.OrdinalIgnoreCase))
            .Where(f => LooksLikeKeyByName(f) || LooksLikeKeyByContent(Path.Combine(root, f)))
            .ToList();

        Assert.True(keyLike.Count == 0, $"Tracked files look like keys or secrets: {string.Join(", ", keyLike)}. Remove them from git, or, for a deliberate public example, put \"TEST-ONLY\" in the file name and document it.");
    }

    [Fact]
    public void LooksLikeKey_PrivateKeyPemOrKeyFileName_Detected()
    {
        // The detector itself must be able to fail: a PEM private key block and the usual key file names are caught.
        var folder = Directory.CreateTempSubdirectory("natremia-secret-scan").FullName;
        try
        {
            var pem = Path.Combine(folder, "notes.txt");
            File.WriteAllText(pem, "-----" + "BEGIN EC PRIVATE KEY" + "-----\nMHcCAQEE\n-----" + "END EC PRIVATE KEY" + "-----\n");
            var clean = Path.Combine(folder, "clean.txt");
            File.WriteAllText(clean, "a public JWK Set has no private members");

            Assert.True(LooksLikeKeyByContent(pem));
            Assert.False(LooksLikeKeyByContent(clean));
            Assert.True(LooksLikeKeyByName("src/CdsNatremia.Service/data/pseudonym.key"));
            Assert.True(LooksLikeKeyByName("deploy/server.pfx"));
            Assert.False(LooksLikeKeyByName("src/CdsNatremia.Service/Security/TokenReplayCache.cs"));
        }
        finally
        {
            Directory.Delete(folder, recursive: true);
        }
    }

    private static bool LooksLikeKeyByName(string path)
    {
        var name = Path.GetFileName(path);
        return KeyExtensions.Any(e => name.EndsWith(e, StringComparison.OrdinalIgnoreCase))
            || KeyFileNames.Any(k => name.Equals(k, StringComparison.OrdinalIgnoreCase));
    }

    private static bool LooksLikeKeyByContent(string path)
    {
        var info = new FileInfo(path);
        if (!info.Exists || info.Length > 2_000_000)
        {
            return false;
        }

        var text = File.ReadAllText(path);
        return PrivateKeyBlock().IsMatch(text) || PrivateJwkMember().IsMatch(text);
    }

    /// <summary>The tracked files (paths relative to the repository root); skips when this is not a git checkout.</summary>
    private static List<string> TrackedFiles(out string root)
    {
        var found = FindRoot();
        Skip.If(found is null, "not a git checkout (no .git above the test binaries), so there is no tracked file to check");
        root = found!;
        var start = new ProcessStartInfo("git", ["ls-files", "-z"])
        {
            WorkingDirectory = root,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        Process? git;
        try
        {
            git = Process.Start(start);
        }
        catch (System.ComponentModel.Win32Exception)
        {
            git = null;
        }

        Skip.If(git is null, "git is not installed, so the tracked files cannot be listed");
        using (git)
        {
            var output = git!.StandardOutput.ReadToEnd();
            git.WaitForExit();
            Skip.If(git.ExitCode != 0, $"git ls-files failed in {root}: {git.StandardError.ReadToEnd().Trim()}");
            var files = output.Split('\0', StringSplitOptions.RemoveEmptyEntries).ToList();
            Assert.NotEmpty(files);
            return files;
        }
    }

    private static string? FindRoot()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            // A worktree has a .git file, a plain clone a .git folder.
            if (Directory.Exists(Path.Combine(dir.FullName, ".git")) || File.Exists(Path.Combine(dir.FullName, ".git")))
            {
                return dir.FullName;
            }
        }

        return null;
    }

    [GeneratedRegex(@"-{5}BEGIN (?:[A-Z0-9]+ )*PRIVATE KEY(?: BLOCK)?-{5}", RegexOptions.CultureInvariant)]
    private static partial Regex PrivateKeyBlock();

    /// <summary>A JWK with a private member: "kty" and a "d" (EC/RSA private exponent) or "k" (symmetric) string.</summary>
    [GeneratedRegex("\"kty\"\\s*:\\s*\"(?:EC|RSA|oct|OKP)\"[^{}]*\"(?:d|k)\"\\s*:\\s*\"[A-Za-z0-9_-]{16,}\"", RegexOptions.CultureInvariant)]
    private static partial Regex PrivateJwkMember();
}
