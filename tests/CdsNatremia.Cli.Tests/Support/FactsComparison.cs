using System.Collections;
using System.Globalization;
using System.Reflection;

namespace CdsNatremia.Cli.Tests.Support;

/// <summary>
/// Structural comparison of two fact trees (<c>PatientFacts</c>, <c>AssembledFacts</c>, or anything built of records,
/// lists, dictionaries and values): walks every public property, list item and dictionary entry, and lists each place
/// where the two differ as "path: left ≠ right", so a failing test says what differs and where, not only that it does.
/// Records' own Equals is not used (their lists compare by reference).
/// </summary>
public static class FactsComparison
{
    /// <summary>Every difference between the two trees (empty when they are structurally equal).</summary>
    public static IReadOnlyList<string> Differences(object? left, object? right, string root = "facts")
    {
        var differences = new List<string>();
        Compare(root, left, right, differences, depth: 0);
        return differences;
    }

    private static void Compare(string path, object? left, object? right, List<string> differences, int depth)
    {
        if (left is null && right is null)
        {
            return;
        }

        if (left is null || right is null)
        {
            differences.Add($"{path}: {Show(left)} ≠ {Show(right)}");
            return;
        }

        // Collections compare by content whatever their concrete type (a list and a read-only copy of it are equal).
        var collections = left is IEnumerable && right is IEnumerable && left is not string && right is not string;
        if (!collections && left.GetType() != right.GetType())
        {
            differences.Add($"{path}: {Show(left)} ({left.GetType().Name}) ≠ {Show(right)} ({right.GetType().Name})");
            return;
        }

        if (depth > 32)
        {
            differences.Add($"{path}: nested deeper than 32 levels (a cycle?)");
            return;
        }

        var type = left.GetType();
        if (!collections && IsValue(type))
        {
            if (!Equals(left, right))
            {
                differences.Add($"{path}: {Show(left)} ≠ {Show(right)}");
            }

            return;
        }

        if (left is IDictionary leftMap && right is IDictionary rightMap)
        {
            var keys = leftMap.Keys.Cast<object>().Concat(rightMap.Keys.Cast<object>()).Distinct().OrderBy(k => k.ToString(), StringComparer.Ordinal);
            foreach (var key in keys)
            {
                Compare($"{path}[{key}]", leftMap.Contains(key) ? leftMap[key] : null, rightMap.Contains(key) ? rightMap[key] : null, differences, depth + 1);
            }

            return;
        }

        if (left is IEnumerable leftItems && right is IEnumerable rightItems)
        {
            var l = leftItems.Cast<object?>().ToList();
            var r = rightItems.Cast<object?>().ToList();
            if (l.Count != r.Count)
            {
                differences.Add($"{path}: {l.Count} items ≠ {r.Count} items");
            }

            for (var i = 0; i < Math.Min(l.Count, r.Count); i++)
            {
                Compare($"{path}[{i}]", l[i], r[i], differences, depth + 1);
            }

            return;
        }

        foreach (var property in type.GetProperties(BindingFlags.Public | BindingFlags.Instance).Where(p => p.CanRead && p.GetIndexParameters().Length == 0).OrderBy(p => p.Name, StringComparer.Ordinal))
        {
            Compare($"{path}.{property.Name}", Read(property, left), Read(property, right), differences, depth + 1);
        }
    }

    private static object? Read(PropertyInfo property, object target)
    {
        try
        {
            return property.GetValue(target);
        }
        catch (TargetInvocationException ex)
        {
            return "(throws " + ex.InnerException?.GetType().Name + ")";
        }
    }

    private static bool IsValue(Type type)
        => type.IsPrimitive || type.IsEnum || type == typeof(string) || type == typeof(decimal) || type == typeof(DateTimeOffset)
           || type == typeof(DateTime) || type == typeof(DateOnly) || type == typeof(TimeSpan) || type == typeof(Guid);

    private static string Show(object? value) => value switch
    {
        null => "null",
        string s => "\"" + s + "\"",
        IFormattable f => f.ToString(null, CultureInfo.InvariantCulture),
        _ => value.GetType().Name,
    };
}
