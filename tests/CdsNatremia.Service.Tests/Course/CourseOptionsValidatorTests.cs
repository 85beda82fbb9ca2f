using CdsNatremia.Service.Course;

namespace CdsNatremia.Service.Tests.Course;

public class CourseOptionsValidatorTests
{
    private static CourseOptions With(string issuer, string clientId, string? secret)
    {
        var options = new CourseOptions();
        options.Ehrs.Add(new SmartEhrOptions { Issuer = issuer, ClientId = clientId, ClientSecret = secret });
        return options;
    }

    [Fact]
    public void Validate_ProductionEhrWithoutSecret_RefusedNamingTheSetting()
    {
        var result = new CourseOptionsValidator(development: false).Validate(null, With("https://ehr.example.org/fhir", "app", null));
        Assert.True(result.Failed);
        Assert.Contains(result.Failures!, f => f.StartsWith("Natremia:Course:Ehrs:0:ClientSecret", StringComparison.Ordinal));
    }

    [Fact]
    public void Validate_ProductionHttpIssuer_Refused()
    {
        var result = new CourseOptionsValidator(development: false).Validate(null, With("http://ehr.example.org/fhir", "app", "TEST-ONLY-secret"));
        Assert.Contains(result.Failures!, f => f.StartsWith("Natremia:Course:Ehrs:0:Issuer", StringComparison.Ordinal));
    }

    [Fact]
    public void Validate_DevelopmentLoopbackHttpWithoutSecret_Accepted()
    {
        var result = new CourseOptionsValidator(development: true).Validate(null, With("http://127.0.0.1:8081/fhir", "app", null));
        Assert.True(result.Succeeded);
    }

    [Fact]
    public void Validate_RelativeLaunchUrl_Refused()
    {
        var options = new CourseOptions { LaunchUrl = "/course/launch" };
        var result = new CourseOptionsValidator(development: true).Validate(null, options);
        Assert.Contains(result.Failures!, f => f.Contains("LaunchUrl", StringComparison.Ordinal));
    }
}
