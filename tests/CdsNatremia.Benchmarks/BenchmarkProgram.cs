using System.Text;
using BenchmarkDotNet.Running;

namespace CdsNatremia.Benchmarks;

/// <summary>
/// Entry point. <c>write-request FILE</c> writes the typical request (dated now) for the load run; <c>allocations [N] [handler|decide|rules]</c>
/// surveys which types the typical request allocates (<see cref="AllocationSurvey"/>); otherwise the
/// arguments go to BenchmarkDotNet, with two conveniences: no filter means every benchmark, and <c>--quick</c> means
/// BenchmarkDotNet's short job (a fast sanity run, not a measurement). See docs/performance.md.
/// </summary>
internal static class BenchmarkProgram
{
    public static int Main(string[] args)
    {
        if (args.Length == 2 && args[0] == "write-request")
        {
            File.WriteAllBytes(args[1], TypicalRequest.Utf8(DateTimeOffset.UtcNow));
            Console.WriteLine($"Wrote the typical request ({new FileInfo(args[1]).Length} bytes) to {args[1]}");
            return 0;
        }

        if (args.Length is >= 1 and <= 3 && args[0] == "allocations")
        {
            return AllocationSurvey.Run(
                args.Length >= 2 ? int.Parse(args[1], System.Globalization.CultureInfo.InvariantCulture) : 2000,
                args.Length == 3 ? args[2] : "handler");
        }

        var list = args.SelectMany(a => a == "--quick" ? new[] { "--job", "short" } : [a]).ToList();
        if (!list.Any(a => a is "--filter" or "-f" or "--list" or "--help" or "-h" or "--version"))
        {
            list.AddRange(["--filter", "*"]);
        }

        Console.OutputEncoding = Encoding.UTF8;
        var summaries = BenchmarkSwitcher.FromAssembly(typeof(BenchmarkProgram).Assembly).Run([.. list]);
        return summaries.Any(s => s.HasCriticalValidationErrors || s.Reports.Any(r => !r.Success)) ? 1 : 0;
    }
}
