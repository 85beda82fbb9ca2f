using Microsoft.Data.Sqlite;

namespace CdsNatremia.Service.Tests.Support;

/// <summary>What a service process left in its SQLite audit file, checked against the calls it answered.</summary>
public static class AuditedCalls
{
    /// <summary>
    /// hookInstance → card uuids in <paramref name="databasePath"/>. With <paramref name="replayLog"/> the file is opened
    /// read-write, so SQLite replays the write-ahead log a killed process left; otherwise read-only.
    /// </summary>
    public static Dictionary<Guid, List<Guid>> CardsByHookInstance(string databasePath, bool replayLog)
    {
        var cards = new Dictionary<Guid, List<Guid>>();
        var mode = replayLog ? "ReadWrite" : "ReadOnly";
        using var connection = new SqliteConnection($"Data Source={databasePath};Mode={mode};Pooling=False");
        connection.Open();
        using var command = connection.CreateCommand();
        command.CommandText = "SELECT hook_instance, card_uuid FROM issued_card";
        using var reader = command.ExecuteReader();
        while (reader.Read())
        {
            var hook = Guid.Parse(reader.GetString(0));
            if (!cards.TryGetValue(hook, out var list))
            {
                cards[hook] = list = [];
            }

            list.Add(Guid.Parse(reader.GetString(1)));
        }

        return cards;
    }

    /// <summary>Every answered call has an audit record with exactly its cards, each once.</summary>
    public static void AssertEachAnsweredCallHasExactlyItsCards(IEnumerable<HookCallResult> answered, Dictionary<Guid, List<Guid>> audited, string when)
    {
        Assert.All(answered, r =>
        {
            Assert.NotEmpty(r.CardUuids); // scenario 01 always gives a card
            Assert.True(audited.TryGetValue(r.HookInstance, out var cards), $"answered call {r.HookInstance} has no audit record{when}");
            Assert.Equal(r.CardUuids.Order(), cards!.Order());
        });
    }
}
