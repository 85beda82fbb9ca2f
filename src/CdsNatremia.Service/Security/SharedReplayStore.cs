using CdsNatremia.Audit.Storage;

namespace CdsNatremia.Service.Security;

/// <summary>
/// The replay store shared by every instance when the audit uses PostgreSQL (<see cref="UsedTokenLedger"/>). If the
/// database cannot be reached the token is refused with 503, never accepted without the check.
/// </summary>
internal sealed class SharedReplayStore(UsedTokenLedger ledger) : ITokenReplayStore
{
    public string Kind => "postgresql";

    public async ValueTask<ReplayCheck> TryUseAsync(string issuer, string jti, DateTimeOffset forgetAfter, DateTimeOffset now, CancellationToken cancellationToken)
    {
        try
        {
            return await ledger.TryUseAsync(issuer, jti, forgetAfter, now, cancellationToken).ConfigureAwait(false)
                ? ReplayCheck.FirstUse
                : ReplayCheck.Replayed;
        }
        catch (Exception ex) when (ex is Npgsql.NpgsqlException or TimeoutException or InvalidOperationException && !cancellationToken.IsCancellationRequested)
        {
            throw new ReplayStoreUnavailableException("the shared replay store (PostgreSQL) could not be reached: " + ex.GetType().Name, ex);
        }
    }
}
