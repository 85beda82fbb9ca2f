using System.ComponentModel.DataAnnotations;

namespace CdsNatremia.Core.Engine;

/// <summary>How an options group's check across settings (<see cref="IValidatableObject"/>) names the group it checks.</summary>
public static class OptionsPath
{
    /// <summary>
    /// The group's path as the validator gave it: options validation names the object-level check "{path}.Validate"
    /// (the host turns the path into the configuration key); a plain DataAnnotations run gives the type name.
    /// </summary>
    public static string Of(ValidationContext context)
    {
        Guard.NotNull(context, nameof(context));
        const string Suffix = "." + nameof(IValidatableObject.Validate);
        var name = context.DisplayName;
        return name.EndsWith(Suffix, StringComparison.Ordinal) ? name[..^Suffix.Length] : name;
    }
}
