namespace CdsNatremia.Service.Security;

/// <summary>What the replay cache says about a token id.</summary>
internal enum ReplayCheck
{
    /// <summary>First use: the id is now remembered until the token expires.</summary>
    FirstUse,

    /// <summary>The id was already used by the same issuer and has not expired.</summary>
    Replayed,

    /// <summary>The cache holds its full capacity of unexpired ids; the token cannot be checked, so it is refused.</summary>
    Full,
}
