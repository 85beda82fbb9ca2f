using System.Security.Cryptography;
using CdsNatremia.Cli.Hosting;
using CdsNatremia.Scenarios;
using Microsoft.Extensions.Time.Testing;
using Microsoft.IdentityModel.JsonWebTokens;
using Microsoft.IdentityModel.Tokens;

namespace CdsNatremia.Cli.Tests.Hosting;

public class ClientAssertionHandlerTests
{
    [Fact]
    public async Task CreateToken_EcKey_Es384WithTheClaimsCdsHooksRequires()
    {
        // CDS Hooks 2.0 "Trusting CDS Clients": alg ES384/RS384, kid, typ JWT; iss, aud (the URL called), exp, iat, jti.
        using var ec = ECDsa.Create(ECCurve.NamedCurves.nistP384);
        var file = Path.GetTempFileName();
        await File.WriteAllTextAsync(file, ec.ExportPkcs8PrivateKeyPem());
        try
        {
            var clock = new FakeTimeProvider(ScenarioLibrary.Anchor);
            var handler = new ClientAssertionHandler(ClientAssertionHandler.LoadKey(file, "key-1"), "https://ehr.example.org", clock);
            var audience = new Uri("http://127.0.0.1:5080/cds-services/natremia-chart-review");
            var token = new JsonWebToken(handler.CreateToken(audience));

            Assert.Equal("ES384", token.Alg);
            Assert.Equal("key-1", token.Kid);
            Assert.Equal("JWT", token.Typ);
            Assert.Equal("https://ehr.example.org", token.Issuer);
            Assert.Equal([audience.ToString()], token.Audiences);
            Assert.Equal(ScenarioLibrary.Anchor.UtcDateTime.AddMinutes(5), token.ValidTo);
            Assert.True(Guid.TryParse(token.Id, out _));

            var validation = await new JsonWebTokenHandler().ValidateTokenAsync(token.EncodedToken, new TokenValidationParameters
            {
                ValidIssuer = "https://ehr.example.org",
                ValidAudience = audience.ToString(),
                IssuerSigningKey = new ECDsaSecurityKey(ec) { KeyId = "key-1" },
                LifetimeValidator = (_, _, _, _) => true,
            });
            Assert.True(validation.IsValid, validation.Exception?.Message);
        }
        finally
        {
            File.Delete(file);
        }
    }

    [Fact]
    public async Task LoadKey_RsaKey_Rs384()
    {
        using var rsa = RSA.Create(2048);
        var file = Path.GetTempFileName();
        await File.WriteAllTextAsync(file, rsa.ExportPkcs8PrivateKeyPem());
        try
        {
            Assert.Equal(SecurityAlgorithms.RsaSha384, ClientAssertionHandler.LoadKey(file, "k").Algorithm);
        }
        finally
        {
            File.Delete(file);
        }
    }
}
