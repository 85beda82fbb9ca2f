namespace CdsNatremia.Core.Facts;

/// <summary>
/// Reasoning with a value that may be a bound (<see cref="LabResult.Comparator"/>). Each question answers true, false, or
/// null when the bound does not decide it; a bound is never treated as the value itself. Pure.
/// </summary>
public static class Bounds
{
    /// <summary>Is the real value strictly above <paramref name="threshold"/>? Null when the bound cannot tell.</summary>
    public static bool? IsAbove(LabResult result, double threshold)
    {
        Guard.NotNull(result, nameof(result));
        var v = result.Value;
        return result.Comparator switch
        {
            null => v > threshold,
            ValueComparator.LessThan => v <= threshold ? false : null,
            ValueComparator.LessOrEqual => v <= threshold ? false : null,
            ValueComparator.GreaterThan => v >= threshold ? true : null,
            ValueComparator.GreaterOrEqual => v > threshold ? true : null,
            _ => null,
        };
    }

    /// <summary>Is the real value strictly below <paramref name="threshold"/>? Null when the bound cannot tell.</summary>
    public static bool? IsBelow(LabResult result, double threshold)
    {
        Guard.NotNull(result, nameof(result));
        var v = result.Value;
        return result.Comparator switch
        {
            null => v < threshold,
            ValueComparator.LessThan => v <= threshold ? true : null,
            ValueComparator.LessOrEqual => v < threshold ? true : null,
            ValueComparator.GreaterThan => v >= threshold ? false : null,
            ValueComparator.GreaterOrEqual => v >= threshold ? false : null,
            _ => null,
        };
    }

    /// <summary>"below 100", "at or below 100", "above 150", "at or above 150", or the bare number for a measurement.</summary>
    public static string Describe(LabResult result)
    {
        Guard.NotNull(result, nameof(result));
        var key = result.Comparator switch
        {
            ValueComparator.LessThan => "cite.bound.below",
            ValueComparator.LessOrEqual => "cite.bound.at-or-below",
            ValueComparator.GreaterThan => "cite.bound.above",
            ValueComparator.GreaterOrEqual => "cite.bound.at-or-above",
            _ => null,
        };
        return key is null
            ? Invariant.Number(result.Value)
            : Rendering.PhraseCatalogue.Default.Render(Findings.Finding.Of(key, Findings.Slot.Number("value", result.Value)), Text.TimeDisplay.Utc(DateTimeOffset.UnixEpoch));
    }
}
