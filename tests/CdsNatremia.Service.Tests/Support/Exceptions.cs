namespace CdsNatremia.Service.Tests.Support;

/// <summary>Start-up failures may arrive wrapped (inner or aggregate exceptions); tests read every message in the chain.</summary>
public static class Exceptions
{
    public static string AllMessages(Exception error)
    {
        var messages = new List<string>();
        for (Exception? e = error; e is not null; e = e.InnerException)
        {
            messages.Add(e.Message);
            if (e is AggregateException aggregate)
            {
                messages.AddRange(aggregate.InnerExceptions.Select(AllMessages));
            }
        }

        return string.Join(" | ", messages);
    }
}
