using System.Text;
using CdsNatremia.Audit.Pseudonyms;
using CdsNatremia.Audit.Storage;

namespace CdsNatremia.Audit.Tests.Pseudonyms;

public sealed class PseudonymKeySourceTests : IDisposable
{
    private readonly string _folder = Path.Combine(Path.GetTempPath(), "natremia-key-tests", Guid.NewGuid().ToString("N"));

    [Fact]
    public void Resolve_ProductionWithoutKey_StopsWithWhatToConfigure()
    {
        var error = Assert.Throws<AuditConfigurationException>(() => PseudonymKeySource.Resolve(null, isDevelopment: false, _folder));
        Assert.Contains("Natremia:Audit:PseudonymKey", error.Message, StringComparison.Ordinal);
        Assert.False(Directory.Exists(_folder), "no key file is made outside Development");
    }

    [Fact]
    public void Resolve_ConfiguredKey_UsedAsIs()
    {
        const string Key = "a-configured-secret-of-more-than-32-characters";
        Assert.Equal(Encoding.UTF8.GetBytes(Key), PseudonymKeySource.Resolve(Key, isDevelopment: false, _folder));
        Assert.Throws<AuditConfigurationException>(() => PseudonymKeySource.Resolve("too-short", isDevelopment: true, _folder));
    }

    [Fact]
    public void Resolve_DevelopmentWithoutKey_GeneratesOnceAndKeepsIt()
    {
        var first = PseudonymKeySource.Resolve(null, isDevelopment: true, _folder);
        var second = PseudonymKeySource.Resolve(null, isDevelopment: true, _folder);

        Assert.Equal(32, first.Length);
        Assert.Equal(first, second);
        var file = Path.Combine(_folder, PseudonymKeySource.DevelopmentKeyFile);
        Assert.True(File.Exists(file));
        if (!OperatingSystem.IsWindows())
        {
            Assert.Equal(UnixFileMode.UserRead | UnixFileMode.UserWrite, File.GetUnixFileMode(file));
        }
    }

    [SkippableFact]
    [System.Runtime.Versioning.UnsupportedOSPlatform("windows")]
    public void Resolve_DevelopmentWithoutKey_FolderOwnerOnlyAndKeyOwnerOnly()
    {
        Skip.If(OperatingSystem.IsWindows(), "Unix permissions only");
        _ = PseudonymKeySource.Resolve(null, isDevelopment: true, _folder);

        Assert.Equal(PrivateFiles.FolderMode, File.GetUnixFileMode(_folder));
        Assert.Equal(PrivateFiles.FileMode, File.GetUnixFileMode(Path.Combine(_folder, PseudonymKeySource.DevelopmentKeyFile)));
    }

    [SkippableFact]
    [System.Runtime.Versioning.UnsupportedOSPlatform("windows")]
    public void Resolve_ExistingKeyReadableByOthers_TightenedTo0600()
    {
        Skip.If(OperatingSystem.IsWindows(), "Unix permissions only");
        Directory.CreateDirectory(_folder);
        var file = Path.Combine(_folder, PseudonymKeySource.DevelopmentKeyFile);
        File.WriteAllText(file, Convert.ToBase64String(new byte[32]));
        File.SetUnixFileMode(file, UnixFileMode.UserRead | UnixFileMode.UserWrite | UnixFileMode.GroupRead | UnixFileMode.OtherRead);
        File.SetUnixFileMode(_folder, UnixFileMode.UserRead | UnixFileMode.UserWrite | UnixFileMode.UserExecute | UnixFileMode.OtherRead | UnixFileMode.OtherExecute);

        _ = PseudonymKeySource.Resolve(null, isDevelopment: true, _folder);

        Assert.Equal(PrivateFiles.FileMode, File.GetUnixFileMode(file));
        Assert.Equal(PrivateFiles.FolderMode, File.GetUnixFileMode(_folder));
    }

    [Fact]
    public void ResolvePrevious_ShortKey_StopsNamingTheSetting()
    {
        var error = Assert.Throws<AuditConfigurationException>(() => PseudonymKeySource.ResolvePrevious([new string('a', 40), "short"]));
        Assert.Contains("Natremia:Audit:PreviousPseudonymKeys:1", error.Message, StringComparison.Ordinal);
        Assert.Equal(2, PseudonymKeySource.ResolvePrevious([new string('a', 40), new string('b', 32)]).Count);
    }

    public void Dispose()
    {
        if (Directory.Exists(_folder))
        {
            Directory.Delete(_folder, recursive: true);
        }
    }
}
