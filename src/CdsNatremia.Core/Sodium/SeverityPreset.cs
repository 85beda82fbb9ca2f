namespace CdsNatremia.Core.Sodium;

/// <summary>Named sets of severity thresholds an operator can choose in configuration.</summary>
public enum SeverityPreset
{
    /// <summary>
    /// 2014 European clinical practice guideline (Spasovski et al., Eur J Endocrinol 2014;170:G1):
    /// mild 130–135, moderate 125–129, profound &lt; 125 mmol/L. The default.
    /// </summary>
    European2014,

    /// <summary>An older teaching cut-off (common practice): severe below 120 mmol/L, moderate 120–129, mild 130–134.</summary>
    SevereBelow120,

    /// <summary>Thresholds taken as configured in <see cref="SeverityOptions"/>.</summary>
    Custom,
}
