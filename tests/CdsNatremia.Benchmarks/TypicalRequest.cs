using System.Text;
using CdsNatremia.Scenarios;

namespace CdsNatremia.Benchmarks;

/// <summary>The typical patient-view request as UTF-8 JSON, dated against the wall clock (the real service uses it too).</summary>
internal static class TypicalRequest
{
    /// <summary>The service the typical request is sent to.</summary>
    public const string ServiceId = "natremia-chart-review";

    /// <summary>The request body for an assessment at <paramref name="now"/>.</summary>
    public static byte[] Utf8(DateTimeOffset now)
        => Encoding.UTF8.GetBytes(TypicalPrefetch.Request(now, Guid.Parse("6f0b3a52-3c4e-4f7e-9d59-0c6f1e2a7b10")).ToJsonString());
}
