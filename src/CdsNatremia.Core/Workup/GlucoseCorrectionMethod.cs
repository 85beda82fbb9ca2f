namespace CdsNatremia.Core.Workup;

/// <summary>Which published glucose correction of serum sodium the work-up uses for its summary; both are always shown.</summary>
public enum GlucoseCorrectionMethod
{
    /// <summary>Katz (N Engl J Med 1973;289:843): + 1.6 mmol/L per 100 mg/dL of glucose above 100 mg/dL.</summary>
    Katz,

    /// <summary>Hillier et al. (Am J Med 1999;106:399): + 2.4 mmol/L per 100 mg/dL of glucose above 100 mg/dL. The default.</summary>
    Hillier,
}
