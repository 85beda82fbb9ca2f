using BenchmarkDotNet.Running;

namespace CdsNatremia.Audit.Benchmarks;

/// <summary>Entry point (not top-level statements: their "Program" would clash with the service's).</summary>
internal static class BenchmarkMain
{
    public static void Main(string[] args) => BenchmarkSwitcher.FromAssembly(typeof(BenchmarkMain).Assembly).Run(args);
}
