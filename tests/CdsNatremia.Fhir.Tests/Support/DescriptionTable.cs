namespace CdsNatremia.Fhir.Tests.Support;

/// <summary>Reads the "System | Code | Kind | Name | Status" table of a knowledge ValueSet's description.</summary>
internal static class DescriptionTable
{
    /// <summary>Status cell by code (the code without its backticks).</summary>
    public static IReadOnlyDictionary<string, string> Rows(string? description)
    {
        var rows = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var line in (description ?? string.Empty).Split('\n'))
        {
            var cells = line.Split('|').Select(c => c.Trim()).ToArray();
            // "| RxNorm | `5487` | concept | hydrochlorothiazide | verified (...) |" splits into 7 cells.
            if (cells.Length >= 7 && cells[2].StartsWith('`') && cells[2].EndsWith('`'))
            {
                rows[cells[2].Trim('`')] = cells[5];
            }
        }

        return rows;
    }
}
