using Spectre.Console;

namespace CdsNatremia.Cli.Replay;

/// <summary>
/// The manifest comparison as a compact table: scenario (its number; the full id is in the JSON), field, expected, seen,
/// result. The prose field <c>clinicianExpects</c> is left out of the table (it is not compared; the JSON lists it).
/// </summary>
internal static class ComparisonTable
{
    public static void Print(IAnsiConsole console, IEnumerable<FieldComparison> rows)
    {
        ArgumentNullException.ThrowIfNull(console);
        ArgumentNullException.ThrowIfNull(rows);
        var table = new Table().Border(TableBorder.Simple).AddColumns("no.", "field", "expected", "seen", "result");
        table.Columns[0].NoWrap();
        table.Columns[4].NoWrap();
        foreach (var row in rows.Where(r => r.Field != ManifestFields.ClinicianExpects))
        {
            var result = row.Result switch
            {
                FieldResult.Pass => "[green]pass[/]",
                FieldResult.Fail => "[red]FAIL[/]",
                _ => "[grey]n/a[/]",
            };
            table.AddRow(new Text(Number(row.Scenario)), new Text(row.Field), new Text(row.Expected), new Text(row.Seen), new Markup(result));
        }

        console.Write(table);
    }

    /// <summary>A scenario's number, the part of its id before the first hyphen ("01" of "01-thiazide-three-weeks").</summary>
    public static string Number(string scenarioId)
    {
        ArgumentNullException.ThrowIfNull(scenarioId);
        var dash = scenarioId.IndexOf('-', StringComparison.Ordinal);
        return dash > 0 ? scenarioId[..dash] : scenarioId;
    }

    /// <summary>The result as the JSON output writes it.</summary>
    public static string Word(FieldResult result) => result switch
    {
        FieldResult.Pass => "pass",
        FieldResult.Fail => "fail",
        _ => "n/a",
    };
}
