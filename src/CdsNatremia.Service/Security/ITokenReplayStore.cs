namespace CdsNatremia.Service.Security;

/// <summary>
/// Where used token ids (issuer, jti) are remembered until their token expires: in this process
/// (<see cref="PartitionedReplayCache"/>, the single-instance SQLite default) or in PostgreSQL, shared by every
/// instance (<see cref="SharedReplayStore"/>), so a token is used once whichever instance receives it.
/// </summary>
internal interface ITokenReplayStore
{
    /// <summary>Records the id if it is new for this issuer; <paramref name="forgetAfter"/> is the token's expiry plus clock skew.</summary>
    /// <exception cref="ReplayStoreUnavailableException">The shared store cannot be reached; the token cannot be checked.</exception>
    ValueTask<ReplayCheck> TryUseAsync(string issuer, string jti, DateTimeOffset forgetAfter, DateTimeOffset now, CancellationToken cancellationToken);

    /// <summary>Where the ids are kept, for the start-up log: "process" or "postgresql".</summary>
    string Kind { get; }
}
