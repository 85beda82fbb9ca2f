using System.Text.Json.Nodes;

namespace CdsNatremia.Service.Tests.Support;

/// <summary>What goes into a test token: header choices and claims; null leaves a claim out.</summary>
public sealed class TokenSpec
{
    public string Algorithm { get; set; } = "ES384";

    public string? Kid { get; set; }

    public string Type { get; set; } = "JWT";

    public string? Jku { get; set; }

    public string? Issuer { get; set; } = TestClientKeys.Issuer;

    public string? Audience { get; set; }

    public DateTimeOffset? IssuedAt { get; set; }

    public DateTimeOffset? Expires { get; set; }

    public DateTimeOffset? NotBefore { get; set; }

    public string? Jti { get; set; } = Guid.NewGuid().ToString();

    public string Payload()
    {
        var payload = new JsonObject();
        if (Issuer is not null)
        {
            payload["iss"] = Issuer;
        }

        if (Audience is not null)
        {
            payload["aud"] = Audience;
        }

        if (IssuedAt is { } iat)
        {
            payload["iat"] = iat.ToUnixTimeSeconds();
        }

        if (Expires is { } exp)
        {
            payload["exp"] = exp.ToUnixTimeSeconds();
        }

        if (NotBefore is { } nbf)
        {
            payload["nbf"] = nbf.ToUnixTimeSeconds();
        }

        if (Jti is not null)
        {
            payload["jti"] = Jti;
        }

        return payload.ToJsonString();
    }
}
