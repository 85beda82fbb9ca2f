namespace CdsNatremia.Cli.Load;

/// <summary>One prepared request of a load test: the service and the body, serialised once.</summary>
/// <param name="ServiceId">The service to call.</param>
/// <param name="Body">The JSON body.</param>
internal sealed record LoadRequest(string ServiceId, string Body);
