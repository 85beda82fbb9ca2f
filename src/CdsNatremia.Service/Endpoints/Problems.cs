using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Mvc;

namespace CdsNatremia.Service.Endpoints;

/// <summary>Error responses as RFC 9457 problem details, with the specific problems listed under "errors".</summary>
internal static class Problems
{
    public static ProblemHttpResult Of(int status, string title, IEnumerable<string> errors)
    {
        var list = errors.ToList();
        var problem = new ProblemDetails
        {
            Status = status,
            Title = title,
            Detail = list.Count == 1 ? list[0] : string.Join(" ", list.Take(5)),
        };
        problem.Extensions["errors"] = list;
        return TypedResults.Problem(problem);
    }
}
