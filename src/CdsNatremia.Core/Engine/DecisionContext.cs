using CdsNatremia.Core.Knowledge;
using CdsNatremia.Core.Sodium;
using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.Engine;

/// <summary>One request's inputs plus values every rule needs, computed once.</summary>
public sealed class DecisionContext
{
    /// <summary>Creates the context; the sodium series and thresholds are computed here, once.</summary>
    public DecisionContext(DecisionRequest request, RuleOptions options, KnowledgeBase knowledge, TimeZoneInfo? displayZone = null)
    {
        Request = Guard.NotNull(request, nameof(request));
        Options = Guard.NotNull(options, nameof(options));
        Knowledge = Guard.NotNull(knowledge, nameof(knowledge));
        Sodium = SodiumSeries.From(request.Facts, request.Now, options.Reading);
        Thresholds = options.Severity.Resolve();
        Display = new TimeDisplay(displayZone ?? TimeZoneInfo.Utc, request.Now);
    }

    /// <summary>How times are shown on this request's cards (display zone, ages from the request's Now).</summary>
    public TimeDisplay Display { get; }

    /// <summary>The request.</summary>
    public DecisionRequest Request { get; }

    /// <summary>The rule options.</summary>
    public RuleOptions Options { get; }

    /// <summary>The loaded knowledge.</summary>
    public KnowledgeBase Knowledge { get; }

    /// <summary>The sodium series.</summary>
    public SodiumSeries Sodium { get; }

    /// <summary>The resolved severity thresholds.</summary>
    public SeverityThresholds Thresholds { get; }
}
