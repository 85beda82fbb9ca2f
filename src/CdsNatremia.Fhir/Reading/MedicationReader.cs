using System.Globalization;
using CdsNatremia.Core.Facts;
using Hl7.Fhir.Model;

namespace CdsNatremia.Fhir.Reading;

/// <summary>
/// Turns MedicationStatement and MedicationRequest into <see cref="MedicationFact"/>s. Kept: statements active, intended or
/// on-hold; requests active or on-hold (and draft, for the order hooks); statements and requests stopped or completed, as
/// <see cref="MedicationUse.Stopped"/> with their end time (the rules filter them by date: prefetch tokens cannot). A
/// medicationReference is resolved to a Medication that is contained or in the received data; an unresolved one keeps its
/// display text, is marked <see cref="MedicationFact.ProductUnreadable"/> and is noted.
/// </summary>
public sealed class MedicationReader
{
    private readonly Func<string, Medication?> _resolve;

    /// <summary>Creates a reader with a resolver for "Medication/{id}" and fullUrl references.</summary>
    public MedicationReader(Func<string, Medication?> resolve) => _resolve = resolve ?? throw new ArgumentNullException(nameof(resolve));

    /// <summary>Reads a statement; null when the patient is not taking or about to take it.</summary>
    public MedicationFact? Read(MedicationStatement statement, string patientId, DataOrigin origin, List<SetAsideItem> setAside)
    {
        ArgumentNullException.ThrowIfNull(statement);
        ArgumentNullException.ThrowIfNull(setAside);
        if (string.IsNullOrEmpty(statement.Id) || !References.IsPatient(statement.Subject?.Reference, patientId))
        {
            return null;
        }

        MedicationUse? use = statement.Status switch
        {
            MedicationStatement.MedicationStatusCodes.Active => MedicationUse.Active,
            MedicationStatement.MedicationStatusCodes.Intended => MedicationUse.Intended,
            MedicationStatement.MedicationStatusCodes.OnHold => MedicationUse.Active,
            MedicationStatement.MedicationStatusCodes.Stopped or MedicationStatement.MedicationStatusCodes.Completed => MedicationUse.Stopped,
            _ => null,
        };
        if (use is null)
        {
            return null;
        }

        var (start, source) = FhirTime.From(statement.Effective) is { } effective
            ? (effective, statement.Effective is Period ? "effectivePeriod.start" : "effectiveDateTime")
            : FhirTime.From(statement.DateAssertedElement?.Value) is { } asserted ? (asserted, "dateAsserted") : ((DateTimeOffset?)null, (string?)null);
        var fact = Build("MedicationStatement", statement.Id, statement.Medication, statement.Contained, use.Value, start, source, origin, setAside);
        return use == MedicationUse.Stopped
            ? fact with
            {
                EndedAt = statement.Effective is Period period ? FhirTime.From(period.EndElement) : null,
                LastRecordedAt = FhirTime.From(statement.DateAssertedElement?.Value) ?? (statement.Effective is FhirDateTime ? start : null),
            }
            : fact;
    }

    /// <summary>Reads a request; null when it is not an active, on-hold or (for drafts) draft order.</summary>
    public MedicationFact? Read(MedicationRequest request, string patientId, DataOrigin origin, bool isDraftOrder, List<SetAsideItem> setAside)
    {
        ArgumentNullException.ThrowIfNull(request);
        ArgumentNullException.ThrowIfNull(setAside);
        if (string.IsNullOrEmpty(request.Id))
        {
            return null;
        }

        // A draft order's subject may be left out by some EHRs; when present it must be this patient.
        if (request.Subject?.Reference is { } subject ? !References.IsPatient(subject, patientId) : !isDraftOrder)
        {
            return null;
        }

        MedicationUse? use = request.Status switch
        {
            MedicationRequest.MedicationrequestStatus.Active or MedicationRequest.MedicationrequestStatus.OnHold
                => isDraftOrder ? MedicationUse.Draft : MedicationUse.Active,
            MedicationRequest.MedicationrequestStatus.Draft => isDraftOrder ? MedicationUse.Draft : MedicationUse.Intended,
            null when isDraftOrder => MedicationUse.Draft,
            MedicationRequest.MedicationrequestStatus.Stopped or MedicationRequest.MedicationrequestStatus.Completed when !isDraftOrder => MedicationUse.Stopped,
            _ => null,
        };
        if (use is null)
        {
            return null;
        }

        var start = FhirTime.From(request.AuthoredOnElement?.Value);
        var fact = Build("MedicationRequest", request.Id, request.Medication, request.Contained, use.Value, start, start is null ? null : "authoredOn", origin, setAside);
        var dosage = request.DosageInstruction?.FirstOrDefault();
        var dose = dosage?.DoseAndRate?.Select(d => d.Dose).OfType<Quantity>().FirstOrDefault();
        return fact with
        {
            VolumeMilliliters = Milliliters(dose) ?? Milliliters(request.DispenseRequest?.Quantity),
            Route = Codings.TextOf(dosage?.Route),
            DosageText = dosage?.Text,
            EndedAt = use == MedicationUse.Stopped ? FhirTime.From(request.DispenseRequest?.ValidityPeriod?.EndElement) : null,
            LastRecordedAt = use == MedicationUse.Stopped ? start : null,
        };
    }

    private MedicationFact Build(
        string type,
        string id,
        DataType? medication,
        List<Resource>? contained,
        MedicationUse use,
        DateTimeOffset? start,
        string? startSource,
        DataOrigin origin,
        List<SetAsideItem> setAside)
    {
        IReadOnlyList<CodeRef> productCodes = [];
        IReadOnlyList<MedicationIngredient> ingredients = [];
        string? text = null;
        string? unreadable = null;
        switch (medication)
        {
            case CodeableConcept concept:
                productCodes = Codings.Of(concept);
                text = Codings.TextOf(concept);
                if (productCodes.Count == 0 && string.IsNullOrWhiteSpace(text))
                {
                    unreadable = "the medicine has neither a code nor a text";
                }

                break;
            case ResourceReference reference:
                var resolved = Resolve(reference.Reference, contained);
                if (resolved is null)
                {
                    text = reference.Display;
                    unreadable = "its Medication resource was not in the data received, so its ingredients could not be read";
                    setAside.Add(new SetAsideItem(
                        $"{type}/{id}",
                        "medication " + (reference.Display ?? reference.Reference ?? "(no reference)"),
                        "its Medication resource was not in the data received; only its display text can be used"));
                }
                else
                {
                    productCodes = Codings.Of(resolved.Code);
                    text = Codings.TextOf(resolved.Code) ?? reference.Display;
                    ingredients = resolved.Ingredient?.Select(ReadIngredient).ToList() ?? [];
                }

                break;
            default:
                unreadable = "the medicine is not given (no medication[x])";
                break;
        }

        return new MedicationFact(type, id, productCodes, ingredients, text, use, start, startSource, origin) { ProductUnreadable = unreadable };
    }

    private Medication? Resolve(string? reference, List<Resource>? contained)
    {
        if (string.IsNullOrWhiteSpace(reference))
        {
            return null;
        }

        if (reference.StartsWith('#'))
        {
            return contained?.OfType<Medication>().FirstOrDefault(m => "#" + m.Id == reference);
        }

        return _resolve(reference);
    }

    private static MedicationIngredient ReadIngredient(Medication.IngredientComponent ingredient) => ingredient.Item switch
    {
        CodeableConcept concept => new MedicationIngredient(Codings.Of(concept), Codings.TextOf(concept), Strength(ingredient.Strength)),
        ResourceReference reference => new MedicationIngredient([], reference.Display, Strength(ingredient.Strength)),
        _ => new MedicationIngredient([], null, Strength(ingredient.Strength)),
    };

    private static string? Strength(Ratio? ratio)
    {
        if (ratio?.Numerator?.Value is not { } n)
        {
            return null;
        }

        var d = ratio.Denominator?.Value ?? 1;
        FormattableString text = $"{n} {ratio.Numerator.Code ?? ratio.Numerator.Unit}/{d} {ratio.Denominator?.Code ?? ratio.Denominator?.Unit}";
        return text.ToString(CultureInfo.InvariantCulture).Trim();
    }

    private static double? Milliliters(Quantity? quantity)
    {
        if (quantity?.Value is not { } value)
        {
            return null;
        }

        var unit = (quantity.Code ?? quantity.Unit)?.Trim();
        return unit switch
        {
            "mL" or "ml" => (double)value,
            "L" or "l" => (double)value * 1000,
            _ => null,
        };
    }
}
