namespace CdsNatremia.Cli.Population;

/// <summary>How many cards a population raised, in total and per 1,000 patients.</summary>
internal sealed record SurveyReport
{
    public required int Seed { get; init; }

    public required int Patients { get; init; }

    public required string AsOf { get; init; }

    public required string ServiceId { get; init; }

    /// <summary>Patients with at least one card.</summary>
    public required int PatientsWithCards { get; init; }

    public required int Cards { get; init; }

    public required double CardsPer1000 { get; init; }

    /// <summary>Cards by indicator (info, warning, critical), per 1,000 patients.</summary>
    public required IReadOnlyDictionary<string, double> Per1000ByIndicator { get; init; }

    /// <summary>Cards by topic code, per 1,000 patients.</summary>
    public required IReadOnlyDictionary<string, double> Per1000ByTopic { get; init; }

    /// <summary>Patients by sodium band as generated.</summary>
    public required IReadOnlyDictionary<string, int> PatientsByBand { get; init; }

    /// <summary>Requests that did not answer 200, by status.</summary>
    public required IReadOnlyDictionary<string, int> Failures { get; init; }
}
