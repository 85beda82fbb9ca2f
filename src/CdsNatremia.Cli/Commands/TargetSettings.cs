using System.ComponentModel;
using Spectre.Console;
using Spectre.Console.Cli;

namespace CdsNatremia.Cli.Commands;

/// <summary>Options shared by every command that talks to a CDS Hooks service.</summary>
internal class TargetSettings : CommandSettings
{
    [CommandOption("--url <URL>")]
    [Description("Base URL of the CDS Hooks service (discovery at {url}/cds-services). Default http://127.0.0.1:5080.")]
    public string Url { get; set; } = "http://127.0.0.1:5080";

    [CommandOption("--in-process")]
    [Description("Start the real CdsNatremia service inside this process on a free loopback port instead of calling --url.")]
    public bool InProcess { get; set; }

    [CommandOption("--allow-host <HOST>")]
    [Description("A non-loopback host the tool may call (repeat for several). Without it only loopback hosts are called.")]
    public string[] AllowHosts { get; set; } = [];

    [CommandOption("--timeout <SECONDS>")]
    [Description("Per-request timeout in seconds (1-120). Default 30.")]
    public int TimeoutSeconds { get; set; } = 30;

    [CommandOption("--signing-key <PEM>")]
    [Description("PEM private key (EC P-384 or RSA) to sign a client JWT for each request (needs --issuer and --kid).")]
    public string? SigningKey { get; set; }

    [CommandOption("--issuer <ISS>")]
    [Description("The JWT 'iss' (the client's identifier as the service trusts it).")]
    public string? Issuer { get; set; }

    [CommandOption("--kid <KID>")]
    [Description("The JWT header 'kid' (the key id in the client's JWK Set).")]
    public string? KeyId { get; set; }

    public override ValidationResult Validate()
    {
        if (!InProcess && (!Uri.TryCreate(Url, UriKind.Absolute, out var url) || (url.Scheme != Uri.UriSchemeHttp && url.Scheme != Uri.UriSchemeHttps)))
        {
            return ValidationResult.Error("--url must be an absolute http(s) URL.");
        }

        if (TimeoutSeconds is < 1 or > 120)
        {
            return ValidationResult.Error("--timeout must be between 1 and 120 seconds.");
        }

        if (SigningKey is not null && (Issuer is null || KeyId is null))
        {
            return ValidationResult.Error("--signing-key needs --issuer and --kid.");
        }

        return ValidationResult.Success();
    }
}
