using System.Text;
using CdsNatremia.Audit.Pseudonyms;

namespace CdsNatremia.Audit.Tests.Pseudonyms;

public sealed class PseudonymKeySourceTests : IDisposable
{
    private readonly string _folder = Path.Combine(Path.GetTempPath(), "natremia-key-tests", Guid.NewGuid().ToString("N"));

    [Fact]
    public void Resolve_ProductionWithoutKey_StopsWithWhatToConfigure()
    {
        var error = Assert.Throws<InvalidOperationException>(() => PseudonymKeySource.Resolve(null, isDevelopment: false, _folder));
        Assert.Contains("Natremia:Audit:PseudonymKey", error.Message, StringComparison.Ordinal);
        Assert.False(Directory.Exists(_folder), "no key file is made outside Development");
    }

    [Fact]
    public void Resolve_ConfiguredKey_UsedAsIs()
    {
        const string Key = "a-configured-secret-of-more-than-32-characters";
        Assert.Equal(Encoding.UTF8.GetBytes(Key), PseudonymKeySource.Resolve(Key, isDevelopment: false, _folder));
        Assert.Throws<InvalidOperationException>(() => PseudonymKeySource.Resolve("too-short", isDevelopment: true, _folder));
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

    public void Dispose()
    {
        if (Directory.Exists(_folder))
        {
            Directory.Delete(_folder, recursive: true);
        }
    }
}
