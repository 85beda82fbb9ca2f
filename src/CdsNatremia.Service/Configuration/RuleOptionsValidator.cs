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
        foreach (var group in new object[] { options.Severity, options.Reading, options.Indicators, options.Workup, options.CorrectionRate, options.Infusion, options.DrugCause })
        {
            var results = new List<ValidationResult>();
            if (!Validator.TryValidateObject(group, new ValidationContext(group), results, validateAllProperties: true))
            {
                failures.AddRange(results.Select(r => $"Natremia:Rules:{group.GetType().Name.Replace("Options", string.Empty, StringComparison.Ordinal)}: {r.ErrorMessage}"));
            }
        }

        if (options.Workup.HypotonicBelow >= options.Workup.HypertonicAbove)
        {
            failures.Add("Natremia:Rules:Workup: HypotonicBelow must be below HypertonicAbove.");
        }

        if (options.Workup.ThyrotropinNormalFrom >= options.Workup.ThyrotropinNormalTo)
        {
            failures.Add("Natremia:Rules:Workup: ThyrotropinNormalFrom must be below ThyrotropinNormalTo.");
        }

        if (options.Workup.FurstStricterRestrictionFrom > options.Workup.FurstRestrictionUnlikelyAbove)
        {
            failures.Add("Natremia:Rules:Workup: FurstStricterRestrictionFrom must not exceed FurstRestrictionUnlikelyAbove.");
        }

        var t = options.Severity.Resolve();
        if (!(t.ModerateFrom < t.MildFrom && t.MildFrom < t.NormalFrom && t.NormalFrom < t.NormalTo))
        {
            failures.Add("Natremia:Rules:Severity: thresholds must rise: ModerateFrom < MildFrom < NormalFrom < NormalTo.");
        }

        var limits = options.CorrectionRate.Resolve();
        if (!(limits.HighRiskDay <= Math.Min(limits.FirstDay, limits.LaterDay) && limits.HighRiskTwoDays <= limits.TwoDays
            && Math.Max(limits.FirstDay, limits.LaterDay) <= limits.TwoDays))
        {
            failures.Add("Natremia:Rules:CorrectionRate: high-risk limits must not exceed the usual ones, and no 24-h limit may exceed the 48-h limit.");
        }

        return failures.Count > 0 ? ValidateOptionsResult.Fail(failures) : ValidateOptionsResult.Success;
    }
}
