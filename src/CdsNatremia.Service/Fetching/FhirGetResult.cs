namespace CdsNatremia.Service.Fetching;

/// <summary>The end of one GET through the pipeline: the last response, or the failure that ended it, and how many attempts it took.</summary>
/// <param name="Response">The last response, when the server answered.</param>
/// <param name="Failure">The exception that ended the GET (network, attempt time-out, open circuit), when no response came.</param>
/// <param name="Attempts">HTTP attempts made (0 when the circuit was open).</param>
internal sealed record FhirGetResult(FhirResponse? Response, Exception? Failure, int Attempts);
