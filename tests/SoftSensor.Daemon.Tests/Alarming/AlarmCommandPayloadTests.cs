using System.Text;
using SoftSensor.Core.Alarms;
using SoftSensor.Daemon.Alarming;

namespace SoftSensor.Daemon.Tests.Alarming;

public class AlarmCommandPayloadTests
{
    private static readonly DateTimeOffset T = new(2026, 3, 1, 8, 0, 0, TimeSpan.Zero);

    private static (bool Ok, AlarmCommand Command, string? Reactor, string Error) Parse(string json)
    {
        bool ok = AlarmCommandPayload.TryParse(Encoding.UTF8.GetBytes(json), T, out var c, out var r, out var e);
        return (ok, c, r, e);
    }

    [Fact]
    public void TryParse_Shelve_GivesKindRuleOperatorAndDuration()
    {
        var p = Parse("""{"command":"shelve","alarm":"rq_window","operator":"anna","shelveMinutes":30,"reactor":"r1"}""");
        Assert.True(p.Ok, p.Error);
        Assert.Equal(new AlarmCommand(AlarmCommandKind.Shelve, "rq_window", T, "anna", TimeSpan.FromMinutes(30)), p.Command);
        Assert.Equal("r1", p.Reactor);
    }

    [Theory]
    [InlineData("""{"command":"ack","alarm":"*","operator":"anna"}""", AlarmCommandKind.Acknowledge)]
    [InlineData("""{"command":"unshelve","alarm":"a","operator":"anna"}""", AlarmCommandKind.Unshelve)]
    [InlineData("""{"command":"remove_from_service","alarm":"a","operator":"tech"}""", AlarmCommandKind.RemoveFromService)]
    [InlineData("""{"command":"return_to_service","alarm":"a","operator":"tech"}""", AlarmCommandKind.ReturnToService)]
    public void TryParse_EveryCommand_Parses(string json, AlarmCommandKind kind)
    {
        var p = Parse(json);
        Assert.True(p.Ok, p.Error);
        Assert.Equal(kind, p.Command.Kind);
    }

    [Theory]
    [InlineData("not json", "alarm command: not JSON (")]
    [InlineData("[1]", "alarm command: expected a JSON object")]
    [InlineData("""{"command":"silence","alarm":"a","operator":"x"}""", "alarm command: command is 'silence', expected acknowledge, shelve, unshelve, remove_from_service or return_to_service")]
    [InlineData("""{"command":"ack","operator":"x"}""", "alarm command: alarm is missing, expected a rule id (or \"*\" with acknowledge)")]
    [InlineData("""{"command":"shelve","alarm":"*","operator":"x","shelveMinutes":5}""", "alarm command: alarm \"*\" only works with acknowledge, not shelve")]
    [InlineData("""{"command":"ack","alarm":"a"}""", "alarm command: operator is '', expected who sends it (1 to 64 characters): the journal records it")]
    [InlineData("""{"command":"shelve","alarm":"a","operator":"x","shelveMinutes":-5}""", "alarm command: shelveMinutes is missing or not a number above 0 (at most 10080), expected how long to shelve")]
    public void TryParse_BadPayload_NamesTheField(string json, string expected)
    {
        var p = Parse(json);
        Assert.False(p.Ok);
        Assert.StartsWith(expected, p.Error, StringComparison.Ordinal);
    }
}
