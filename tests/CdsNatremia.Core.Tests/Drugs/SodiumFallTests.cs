using CdsNatremia.Core.Drugs;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Tests.Support;

namespace CdsNatremia.Core.Tests.Drugs;

public class SodiumFallTests
{
    // Lower limit of normal 135 mmol/L (reference sheet: 135 or 136 to 145, common practice; the 2014 European guideline
    // defines hyponatremia as < 135). Meaningful drop 4 mmol/L (DrugCauseOptions default, common practice).
    private const double NormalFrom = 135;
    private const double Drop = 4;

    private static LabResult[] Series(params double[] valuesOldestFirst)
        => valuesOldestFirst.Select((v, i) => Some.Sodium(v, hoursAgo: 24 * (valuesOldestFirst.Length - i), id: "na-" + i)).ToArray();

    [Fact]
    public void Find_NormalThenLow_BeforeIsTheNormalResult()
    {
        var fall = SodiumFall.Find(Series(138, 124), NormalFrom, Drop)!;
        Assert.Equal(138, fall.Before!.Value);
        Assert.Equal(124, fall.FirstLow.Value);
        Assert.Equal(124, fall.Latest.Value);
    }

    [Theory]
    [InlineData(135.0, true)]  // at the lower limit of normal: normal, so it is the result before the fall
    [InlineData(134.9, false)] // just below: low, and only 2.9 above the latest 132 (< 4): not before the fall
    public void Find_LowerLimitOfNormal_Boundary(double earlier, bool hasBefore)
    {
        var fall = SodiumFall.Find(Series(earlier, 132), NormalFrom, Drop)!;
        Assert.Equal(hasBefore, fall.Before is not null);
    }

    [Theory]
    [InlineData(131.0, true)]  // 131 − 127 = 4: exactly the meaningful drop, a fall
    [InlineData(130.9, false)] // 3.9: within variation, no fall on record
    public void Find_MeaningfulDrop_Boundary(double earlier, bool hasBefore)
    {
        var fall = SodiumFall.Find(Series(earlier, 127), NormalFrom, Drop)!;
        Assert.Equal(hasBefore, fall.Before is not null);
        Assert.Equal(hasBefore ? 127 : earlier, fall.FirstLow.Value);
    }

    [Fact]
    public void Find_StepwiseFall_FirstLowIsTheFirstResultAtTheCurrentLevel()
    {
        // 133, 132, 128, 127: the newest result ≥ 127 + 4 is 132; the first result after it (128) is at the current level.
        var fall = SodiumFall.Find(Series(133, 132, 128, 127), NormalFrom, Drop)!;
        Assert.Equal(132, fall.Before!.Value);
        Assert.Equal(128, fall.FirstLow.Value);
    }

    [Fact]
    public void Find_LatestNormal_NoFall()
        => Assert.Null(SodiumFall.Find(Series(128, 136), NormalFrom, Drop));

    [Fact]
    public void Find_Empty_NoFall()
        => Assert.Null(SodiumFall.Find([], NormalFrom, Drop));

    [Fact]
    public void Find_SingleLowResult_NoBeforeAndFirstLowIsIt()
    {
        var fall = SodiumFall.Find(Series(124), NormalFrom, Drop)!;
        Assert.Null(fall.Before);
        Assert.Equal(124, fall.FirstLow.Value);
    }

    [Fact]
    public void Find_RecoveringSodium_FallMeasuredToTheNadirNotTheLatest()
    {
        // Found in review: 134, then 119, then 131 while recovering. The fall ran from 134 to 119 (a drop of 15 ≥ the
        // meaningful 4 mmol/L); measured against the latest 131 it would have looked like no fall at all.
        var fall = SodiumFall.Find(Series(134, 119, 131), NormalFrom, Drop)!;
        Assert.Equal(134, fall.Before!.Value);
        Assert.Equal(119, fall.FirstLow.Value);
        Assert.Equal(131, fall.Latest.Value);
    }
}
