using System.Diagnostics.Tracing;
using System.Globalization;

namespace CdsNatremia.Benchmarks;

/// <summary>
/// <c>allocations [N] [handler|decide|rules]</c>: which types the typical request allocates, by the runtime's own
/// sampling (the GC's AllocationTick event, about one sample per 100 KB allocated, read in process with an
/// <see cref="EventListener"/>). Runs the handler path (<see cref="WholeRequestBenchmarks.HandleInProcess"/>), the
/// assessment or the rules alone N times (default 2,000) after a warm-up and prints the 25 types with the most sampled
/// bytes and their share. A survey to direct work, not a measurement:
/// BenchmarkDotNet's allocated bytes per operation are the numbers to quote.
/// </summary>
internal static class AllocationSurvey
{
    public static int Run(int requests, string part)
    {
        Func<object> work;
        Action cleanup = () => { };
        switch (part)
        {
            case "handler":
                var whole = new WholeRequestBenchmarks();
                whole.Setup();
                work = () => whole.HandleInProcess().GetAwaiter().GetResult();
                cleanup = whole.Cleanup;
                break;
            case "decide" or "rules":
                var assessment = new AssessmentBenchmarks();
                assessment.Setup();
                work = part == "decide" ? assessment.Decide : assessment.Rules;
                break;
            default:
                Console.Error.WriteLine($"unknown part '{part}': handler, decide or rules");
                return 2;
        }

        try
        {
            for (var i = 0; i < 200; i++)
            {
                work();
            }

            using var listener = new AllocationListener();
            var before = GC.GetAllocatedBytesForCurrentThread();
            for (var i = 0; i < requests; i++)
            {
                work();
            }

            var perRequest = (GC.GetAllocatedBytesForCurrentThread() - before) / (double)requests;
            var total = listener.Bytes.Values.Sum();
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{part}: {requests} runs, {perRequest / 1024:F0} KB allocated per run on the calling thread; sampled by type:"));
            foreach (var (type, bytes) in listener.Bytes.OrderByDescending(kv => kv.Value).Take(25))
            {
                Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{100.0 * bytes / total,6:F1} %  {type}"));
            }

            return 0;
        }
        finally
        {
            cleanup();
        }
    }

    private sealed class AllocationListener : EventListener
    {
        private const EventKeywords GcKeyword = (EventKeywords)0x1;

        public Dictionary<string, long> Bytes { get; } = new(StringComparer.Ordinal);

        protected override void OnEventSourceCreated(EventSource eventSource)
        {
            if (eventSource.Name == "Microsoft-Windows-DotNETRuntime")
            {
                EnableEvents(eventSource, EventLevel.Verbose, GcKeyword);
            }
        }

        protected override void OnEventWritten(EventWrittenEventArgs eventData)
        {
            if (eventData.EventName is not { } name || !name.StartsWith("GCAllocationTick", StringComparison.Ordinal) || eventData.PayloadNames is null)
            {
                return;
            }

            var type = eventData.Payload![eventData.PayloadNames.IndexOf("TypeName")] as string ?? "?";
            var amountIndex = eventData.PayloadNames.IndexOf("AllocationAmount64");
            var amount = amountIndex >= 0 ? Convert.ToInt64(eventData.Payload[amountIndex], CultureInfo.InvariantCulture) : 100_000;
            lock (Bytes)
            {
                Bytes[type] = Bytes.GetValueOrDefault(type) + amount;
            }
        }
    }
}
