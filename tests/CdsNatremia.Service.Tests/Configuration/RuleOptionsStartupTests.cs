using System.ComponentModel.DataAnnotations;
using System.Globalization;
using System.Reflection;
using CdsNatremia.Core.Engine;
using CdsNatremia.Service.Configuration;
using CdsNatremia.Service.Tests.Support;

namespace CdsNatremia.Service.Tests.Configuration;

/// <summary>
/// Every nested rule-options group is checked by the framework's validation at start-up: for each group (found by
/// reflection, so a new group is covered without editing this test) a setting out of its [Range], or an enum number
/// the enum does not define, refuses the start with a line that names the setting's configuration key.
/// </summary>
public sealed class RuleOptionsStartupTests
{
    private static readonly TimeSpan Wait = TimeSpan.FromSeconds(90);

    /// <summary>Per group: its first checked setting and a value its own check refuses.</summary>
    public static TheoryData<string, string, string> OutOfRange()
    {
        var data = new TheoryData<string, string, string>();
        foreach (var group in typeof(RuleOptions).GetProperties())
        {
            var (setting, value) = FirstRefusable(group.PropertyType);
            data.Add(group.Name, setting, value);
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(OutOfRange))]
    public void Validate_GroupSettingOutOfRange_FailsWithTheKeyFirst(string group, string setting, string value)
    {
        var options = new RuleOptions();
        var target = typeof(RuleOptions).GetProperty(group)!.GetValue(options)!;
        var property = target.GetType().GetProperty(setting)!;
        var type = Nullable.GetUnderlyingType(property.PropertyType) ?? property.PropertyType;
        property.SetValue(target, type.IsEnum ? Enum.ToObject(type, int.Parse(value, CultureInfo.InvariantCulture)) : Convert.ChangeType(value, type, CultureInfo.InvariantCulture));

        var result = new RuleOptionsValidator().Validate(null, options);

        Assert.True(result.Failed);
        Assert.StartsWith($"Natremia:Rules:{group}:{setting}: ", Assert.Single(result.Failures!), StringComparison.Ordinal);
    }

    [Theory]
    [MemberData(nameof(OutOfRange))]
    public void Start_GroupSettingOutOfRange_RefusedNamingTheSetting(string group, string setting, string value)
    {
        using var factory = NatremiaFactory.With(new() { [$"Natremia:Rules:{group}:{setting}"] = value });

        var error = Record.Exception(() => factory.CreateClient());

        Assert.NotNull(error);
        var reason = StartupRefusal.Describe(error);
        Assert.NotNull(reason);
        Assert.StartsWith($"Natremia:Rules:{group}:{setting}: ", reason, StringComparison.Ordinal);
    }

    [Fact]
    public void Validate_CheckAcrossSettingsFails_LineNamesTheGroup()
    {
        // Stricter Furst band starting above the "restriction unlikely" edge: the bands would overlap (Furst et al. 2000; bands from memory).
        var options = new RuleOptions();
        options.Workup.FurstStricterRestrictionFrom = 1.2;
        options.Workup.FurstRestrictionUnlikelyAbove = 1.0;

        var result = new RuleOptionsValidator().Validate(null, options);

        Assert.Equal(["Natremia:Rules:Workup: FurstStricterRestrictionFrom must not exceed FurstRestrictionUnlikelyAbove."], result.Failures);
    }

    [Fact]
    public async Task Start_ProcessWithARuleSettingOutOfRange_OneLineNamingTheSettingAndExitCode78()
    {
        await using var service = ServiceProcess.Start("Development", new Dictionary<string, string?> { ["Natremia:Rules:Infusion:Saline3Sodium"] = "5" });
        var exit = await service.WaitForExitAsync(Wait);

        Assert.True(exit is not null, $"the service kept running; output: {service.StandardOutput}");
        Assert.Equal(StartupRefusal.ExitCode, exit);
        var line = Assert.Single(service.StandardError.Trim().Split('\n', StringSplitOptions.RemoveEmptyEntries));
        // 3 % saline is 513 mmol/L sodium (InfusionOptions: [Range(300, 700)]); 5 is refused.
        Assert.Equal("crit: CdsNatremia.Service refused to start: Natremia:Rules:Infusion:Saline3Sodium: The field Saline3Sodium must be between 300 and 700.", line.Trim());
    }

    private static (string Setting, string Value) FirstRefusable(Type group)
    {
        foreach (var property in group.GetProperties())
        {
            if (property.GetCustomAttribute<RangeAttribute>() is { } range)
            {
                var below = Convert.ToDouble(range.Minimum, CultureInfo.InvariantCulture) - 1;
                var value = property.PropertyType == typeof(int) ? ((int)Math.Floor(below)).ToString(CultureInfo.InvariantCulture) : below.ToString(CultureInfo.InvariantCulture);
                return (property.Name, value);
            }

            if (property.GetCustomAttribute<EnumDataTypeAttribute>() is { } enumType)
            {
                var undefined = Enum.GetValues(enumType.EnumType).Cast<object>().Select(Convert.ToInt32).Max() + 7;
                return (property.Name, undefined.ToString(CultureInfo.InvariantCulture));
            }
        }

        throw new InvalidOperationException($"{group.Name} has no setting with a check.");
    }
}
