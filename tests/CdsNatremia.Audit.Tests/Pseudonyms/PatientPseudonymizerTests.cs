using CdsNatremia.Audit.Pseudonyms;

namespace CdsNatremia.Audit.Tests.Pseudonyms;

public sealed class PatientPseudonymizerTests
{
    [Fact]
    public void Pseudonym_Rfc4231TestCase6_MatchesPublishedHmacSha256()
    {
        // RFC 4231 section 4.7 (test case 6): key = 131 bytes of 0xaa, data = the sentence below.
        var pseudonymizer = new PatientPseudonymizer(Enumerable.Repeat((byte)0xaa, 131).ToArray());
        Assert.Equal(
            "60e431591ee0b67f0d8a26aacbf5b77f8e0bc6213728c5140546040f0ee37f54",
            pseudonymizer.Pseudonym("Test Using Larger Than Block-Size Key - Hash Key First"));
    }

    [Fact]
    public void Pseudonym_SameIdSameKey_Stable_OtherKey_Different()
    {
        var a = new PatientPseudonymizer(Enumerable.Repeat((byte)1, 32).ToArray());
        var b = new PatientPseudonymizer(Enumerable.Repeat((byte)2, 32).ToArray());
        Assert.Equal(a.Pseudonym("s01-pt"), a.Pseudonym("s01-pt"));
        Assert.NotEqual(a.Pseudonym("s01-pt"), a.Pseudonym("s02-pt"));
        Assert.NotEqual(a.Pseudonym("s01-pt"), b.Pseudonym("s01-pt"));
        Assert.DoesNotContain("s01", a.Pseudonym("s01-pt"), StringComparison.Ordinal);
    }

    [Fact]
    public void Constructor_KeyShorterThan32Bytes_Refused()
        => Assert.Throws<ArgumentException>(() => new PatientPseudonymizer(new byte[31]));

    [Fact]
    public void KeyId_PerKey_StableDifferentAndNotTheKey()
    {
        var keyA = Enumerable.Repeat((byte)1, 32).ToArray();
        var keyB = Enumerable.Repeat((byte)2, 32).ToArray();

        Assert.Equal(new PatientPseudonymizer(keyA).KeyId, new PatientPseudonymizer(keyA).KeyId);
        Assert.NotEqual(new PatientPseudonymizer(keyA).KeyId, new PatientPseudonymizer(keyB).KeyId);
        Assert.Matches("^[0-9a-f]{12}$", new PatientPseudonymizer(keyA).KeyId);
        Assert.DoesNotContain(Convert.ToHexStringLower(keyA)[..12], new PatientPseudonymizer(keyA).KeyId, StringComparison.Ordinal);
    }

    [Fact]
    public void AllPseudonyms_AfterRotation_CurrentKeyFirstThenEachPreviousKey()
    {
        var oldKey = Enumerable.Repeat((byte)1, 32).ToArray();
        var newKey = Enumerable.Repeat((byte)2, 32).ToArray();
        var before = new PatientPseudonymizer(oldKey);
        var after = new PatientPseudonymizer(newKey, [oldKey, newKey]);

        var all = after.AllPseudonyms("s01-pt");

        Assert.Equal(after.Pseudonym("s01-pt"), all[0].Pseudonym);
        Assert.Equal(after.KeyId, all[0].KeyId);
        Assert.Equal(new KeyedPseudonym(before.KeyId, before.Pseudonym("s01-pt")), all[1]);
        Assert.Equal(2, all.Count); // the current key listed again among the previous ones is not repeated
        Assert.Equal([before.KeyId], after.PreviousKeyIds);
    }
}
