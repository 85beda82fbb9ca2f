using System.ComponentModel.DataAnnotations;
using CdsNatremia.Core.Engine;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Configuration;

/// <summary>Validates every rule options group with its [Range] attributes, and the band order.</summary>
internal sealed class RuleOptionsValidator : IValidateOptions<RuleOptions>
{
    public ValidateOptionsResult Validate(string? name, RuleOptions options)
    {
        var failures = new List<string>();
        foreach (var group in new object[] { options.Severity, options.Reading, options.Indicators })
        {
            var results = new List<ValidationResult>();
            if (!Validator.TryValidateObject(group, new ValidationContext(group), results, validateAllProperties: true))
            {
                failures.AddRange(results.Select(r => $"Natremia:Rules:{group.GetType().Name.Replace("Options", string.Empty, StringComparison.Ordinal)}: {r.ErrorMessage}"));
            }
        }

        var drugCauseResults = new List<ValidationResult>();
        if (!Validator.TryValidateObject(options.DrugCause, new ValidationContext(options.DrugCause), drugCauseResults, validateAllProperties: true))
        {
            failures.AddRange(drugCauseResults.Select(r => $"Natremia:Rules:DrugCause: {r.ErrorMessage}"));
        }

        var t = options.Severity.Resolve();
        if (!(t.ModerateFrom < t.MildFrom && t.MildFrom < t.NormalFrom && t.NormalFrom < t.NormalTo))
        {
            failures.Add("Natremia:Rules:Severity: thresholds must rise: ModerateFrom < MildFrom < NormalFrom < NormalTo.");
        }

        return failures.Count > 0 ? ValidateOptionsResult.Fail(failures) : ValidateOptionsResult.Success;
    }
}
