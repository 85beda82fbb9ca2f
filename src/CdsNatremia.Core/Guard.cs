namespace CdsNatremia.Core;

/// <summary>One place for argument checks, so every public entry point fails the same way.</summary>
internal static class Guard
{
    public static T NotNull<T>(T? value, string name) where T : class
        => value ?? throw new ArgumentNullException(name);

    public static double Finite(double value, string name)
        => double.IsFinite(value) ? value : throw new ArgumentOutOfRangeException(name, value, "Value must be a finite number.");
}
