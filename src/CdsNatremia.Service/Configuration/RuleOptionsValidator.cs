using System.Text.RegularExpressions;
using CdsNatremia.Core.Engine;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Service.Configuration;

/// <summary>
/// Validates the rule options with the framework's source-generated validator (<see cref="RuleOptionsAnnotations"/>):
/// it follows every group <see cref="RuleOptions"/> marks <see cref="ValidateObjectMembersAttribute"/> and checks the
/// group's own attributes ([Range], [EnumDataType]) and its checks across settings (<c>IValidatableObject</c>), so a
/// new group cannot be left out by a list kept here. Each failure is given as one line that starts with the
/// configuration key an operator sets ("Natremia:Rules:Workup:HypotonicBelow: The field HypotonicBelow must be between
/// 250 and 300."), which start-up prints as its refusal (<see cref="StartupRefusal"/>).
/// </summary>
internal sealed partial class RuleOptionsValidator : IValidateOptions<RuleOptions>
{
    /// <summary>The configuration section the rule options bind from.</summary>
    public const string Section = NatremiaServiceOptions.Section + ":Rules";

    private readonly RuleOptionsAnnotations _annotations = new();

    public ValidateOptionsResult Validate(string? name, RuleOptions options)
    {
        var result = _annotations.Validate(Section, options);
        return result.Failed ? ValidateOptionsResult.Fail(result.Failures.Select(AsSettingLine)) : result;
    }

    /// <summary>
    /// The generated validator prefixes a failure with the member ("HypotonicBelow: …") and names the member by the path
    /// it was given joined with '.' ("Natremia:Rules.Workup.HypotonicBelow"); configuration keys join with ':'. The line
    /// starts with the key, and the text keeps the member's own name.
    /// </summary>
    private static string AsSettingLine(string failure)
    {
        var text = MemberPrefix().Replace(failure, string.Empty, 1);
        var path = Path().Match(text);
        if (!path.Success)
        {
            return failure;
        }

        var key = path.Value.Replace('.', ':');
        var member = path.Value[(path.Value.LastIndexOf('.') + 1)..];
        var rest = text.Remove(path.Index, path.Length).Insert(path.Index, member).Trim();
        return text.StartsWith(path.Value + ":", StringComparison.Ordinal)
            ? key + text[path.Length..] // a check across settings already names its group first
            : key + ": " + rest;
    }

    [GeneratedRegex(@"^[A-Za-z0-9]+(, [A-Za-z0-9]+)*: ", RegexOptions.CultureInvariant)]
    private static partial Regex MemberPrefix();

    [GeneratedRegex(@"Natremia:Rules(\.[A-Za-z0-9]+)+", RegexOptions.CultureInvariant)]
    private static partial Regex Path();
}

/// <summary>Generated at build time by the options source generator from the attributes on <see cref="RuleOptions"/> and its groups.</summary>
[OptionsValidator]
internal sealed partial class RuleOptionsAnnotations : IValidateOptions<RuleOptions>;
