namespace CdsNatremia.Service.Tests.Support;

/// <summary>One service in memory that trusts one test client (keys inline), shared by a test class.</summary>
public sealed class TrustedClientFixture : IDisposable
{
    public TrustedClientFixture() => Host = new SecuredHost(Keys.InlineSettings());

    public TestClientKeys Keys { get; } = new();

    public SecuredHost Host { get; }

    public void Dispose()
    {
        Host.Dispose();
        Keys.Dispose();
    }
}
