using System.ComponentModel.DataAnnotations;
using System.Reflection;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Workup;
using Microsoft.Extensions.Options;

namespace CdsNatremia.Core.Tests.Conventions;

/// <summary>
/// Every rule setting is checked at start-up by the framework's options validation: each nested group is marked
/// [ValidateObjectMembers] (so validation reaches it), each number carries a [Range] and each enum an [EnumDataType]
/// (so a value out of range or an undefined enum number refuses the start). A new group or setting without them fails here.
/// </summary>
public class OptionsValidationTests
{
    public static TheoryData<string> Groups() => [.. typeof(RuleOptions).GetProperties().Select(p => p.Name)];

    [Fact]
    public void RuleOptions_EveryNestedGroup_IsMarkedValidateObjectMembers()
    {
        var unmarked = Walk(typeof(RuleOptions), "Rules")
            .Where(p => IsGroup(p.Property.PropertyType) && p.Property.GetCustomAttribute<ValidateObjectMembersAttribute>() is null)
            .Select(p => p.Path)
            .ToList();
        Assert.Empty(unmarked);
    }

    [Fact]
    public void RuleOptions_EverySetting_CarriesItsCheck()
    {
        var unchecked_ = Walk(typeof(RuleOptions), "Rules")
            .Where(p => !IsGroup(p.Property.PropertyType) && !HasCheck(p.Property))
            .Select(p => p.Path)
            .ToList();
        Assert.Empty(unchecked_);
    }

    [Fact]
    public void CoreAssembly_EveryOptionsClass_IsReachableFromRuleOptions()
    {
        var reachable = Walk(typeof(RuleOptions), "Rules").Select(p => p.Property.PropertyType).Append(typeof(RuleOptions)).ToHashSet();
        var options = typeof(RuleOptions).Assembly.GetTypes()
            .Where(t => t.IsClass && t.IsPublic && t.Name.EndsWith("Options", StringComparison.Ordinal))
            .ToList();
        Assert.NotEmpty(options);
        Assert.All(options, t => Assert.True(reachable.Contains(t), $"{t.Name} is not a group of RuleOptions, so start-up would never check it."));
    }

    [Theory]
    [MemberData(nameof(Groups))]
    public void Defaults_EveryGroup_PassItsOwnChecks(string group)
    {
        var value = typeof(RuleOptions).GetProperty(group)!.GetValue(new RuleOptions())!;
        var results = new List<ValidationResult>();
        Assert.True(Validator.TryValidateObject(value, new ValidationContext(value), results, validateAllProperties: true), string.Join("; ", results.Select(r => r.ErrorMessage)));
    }

    [Fact]
    public void Validate_WorkupEdgesCrossed_NamesTheGroupAndBothSettings()
    {
        // Tonicity edges (WorkupOptions doc comments: hypotonic < 275, hypertonic > 295 mOsm/kg): the lower edge must stay below the upper.
        var options = new WorkupOptions { HypotonicBelow = 290, HypertonicAbove = 285 };
        var results = new List<ValidationResult>();
        Assert.False(Validator.TryValidateObject(options, new ValidationContext(options), results, validateAllProperties: true));
        Assert.Equal("WorkupOptions: HypotonicBelow must be below HypertonicAbove.", Assert.Single(results).ErrorMessage);
    }

    private static bool IsGroup(Type type) => type.IsClass && type != typeof(string);

    private static bool HasCheck(PropertyInfo property)
    {
        var type = Nullable.GetUnderlyingType(property.PropertyType) ?? property.PropertyType;
        if (type.IsEnum)
        {
            return property.GetCustomAttribute<EnumDataTypeAttribute>() is { } e && e.EnumType == type;
        }

        if (type == typeof(double) || type == typeof(int) || type == typeof(long) || type == typeof(decimal))
        {
            return property.GetCustomAttribute<RangeAttribute>() is not null;
        }

        return true; // text (citations, band names) and switches (bool) have no range
    }

    private static IEnumerable<(PropertyInfo Property, string Path)> Walk(Type type, string path)
    {
        foreach (var property in type.GetProperties(BindingFlags.Public | BindingFlags.Instance).Where(p => p.CanWrite))
        {
            var here = path + ":" + property.Name;
            yield return (property, here);
            if (IsGroup(property.PropertyType))
            {
                foreach (var inner in Walk(property.PropertyType, here))
                {
                    yield return inner;
                }
            }
        }
    }
}
