using SoftSensor.Core.Alarms;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Alarming;

namespace SoftSensor.Daemon.Tests.Alarming;

public sealed class AlarmRuleFileTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("softsensor-rules-").FullName;

    public static string ConfigDir
    {
        get
        {
            var d = new DirectoryInfo(AppContext.BaseDirectory);
            while (d is not null && !File.Exists(Path.Combine(d.FullName, "SoftSensor.sln")))
            {
                d = d.Parent;
            }

            return Path.Combine(d?.FullName ?? throw new DirectoryNotFoundException("SoftSensor.sln not found above " + AppContext.BaseDirectory), "config", "alarms");
        }
    }

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public void Load_ShippedExampleFiles_AreValidAndCarryTheSafetyLimits()
    {
        var set = AlarmRuleFile.Load(Directory.GetFiles(ConfigDir, "*.json").Order(StringComparer.Ordinal));
        Assert.Empty(set.Errors);
        Assert.Equal(TimeSpan.FromHours(8), set.MaxShelve);
        var o2 = Assert.Single(set.Rules, r => r.Id == "offgas_o2_enriched");
        // 23.5 % O2 by volume: the common occupational threshold of an oxygen-enriched atmosphere
        // (US OSHA 29 CFR 1910.146(b), from memory; docs/methods.md §5 calls it common practice).
        Assert.Equal((AlarmConditionKind.High, 23.5, "safety"), (o2.Kind, o2.Limit, o2.Category));
        Assert.Equal(SignalRef.Input(SignalRole.OutletO2Percent), o2.Source);
        Assert.Contains(set.Rules, r => r.Id == "vessel_pressure_high_high" && r.Kind == AlarmConditionKind.HighHigh);
        Assert.Contains(set.Rules, r => r.Id == "temperature_excursion" && r.Kind == AlarmConditionKind.Deviation);
        Assert.Contains(set.Rules, r => r.Id == "feed_above_advisory" && r.Reference == SignalRef.Estimate(EstimateNames.FeedAdvisoryLPerH));
        Assert.Contains(set.Rules, r => r.Id == "feed_above_oxygen_cap" && r.Reference == SignalRef.Estimate(EstimateNames.FeedCapLPerH));
        Assert.Contains(set.Rules, r => r.Id == "do_low_while_feeding" && r.Gate == SignalRef.Input(SignalRole.FeedRateLPerH));
        Assert.All(set.Rules.Where(r => r.Category == "feed" && r.Reference is not null), r => Assert.True(r.SuppressesWhenBad)); // a feed alert against an estimate is silent while that estimate is bad
        Assert.All(set.Rules.Where(r => r.Category == "quality"), r => Assert.False(r.SuppressesWhenBad));
    }

    [Fact]
    public void Load_BadFields_NameTheFileTheRuleAndTheField()
    {
        string path = Path.Combine(_dir, "bad.json");
        File.WriteAllText(path, """
            { "maxShelveHours": 0, "rules": [
              { "id": "a", "kind": "higher", "source": "input:Nope", "priority": "urgent" },
              { "kind": "low", "source": "rq", "limit": 1, "onDelaySeconds": -1 },
              { "id": "c", "kind": "window", "source": "rq", "low": 1, "high": 2, "priority": "extreme" },
              { "id": "d", "kind": "low_low", "source": "rq" }
            ] }
            """);
        var set = AlarmRuleFile.Load([path]);
        Assert.Equal(
        [
            $"alarm rule file '{path}': maxShelveHours is 0, expected above 0 and at most 168",
            $"alarm rule file '{path}', rule 1 ('a'): kind is 'higher', expected one of high, high_high, low, low_low, window, rate_of_change, deviation, above_reference, bad_quality, inconsistent, flat_line",
            $"alarm rule file '{path}', rule 1 ('a'): source: 'input:Nope': 'Nope' is not a signal role; expected one of " + string.Join(", ", Enum.GetNames<SignalRole>()),
            $"alarm rule file '{path}', rule 2: id is missing",
            $"alarm rule file '{path}', rule 2: onDelaySeconds is -1, expected 0 to 604800 seconds",
            $"alarm rule file '{path}', rule 3 ('c'): priority is 'extreme', expected one of low, medium, high, urgent",
            "alarm rule 'd': limit is NaN, expected a finite number",
        ], set.Errors);
    }

    [Fact]
    public void Load_UnknownKeyOrBrokenJson_IsAnErrorNotAnException()
    {
        string unknown = Path.Combine(_dir, "unknown.json");
        File.WriteAllText(unknown, """{ "rules": [ { "id": "a", "kind": "high", "source": "rq", "limit": 1, "threshold": 2 } ] }""");
        string broken = Path.Combine(_dir, "broken.json");
        File.WriteAllText(broken, "{ \"rules\": [ ");
        var set = AlarmRuleFile.Load([unknown, broken, Path.Combine(_dir, "missing.json")]);
        Assert.Equal(3, set.Errors.Count);
        Assert.Contains("threshold", set.Errors[0], StringComparison.Ordinal);
        Assert.StartsWith($"alarm rule file '{broken}': ", set.Errors[1], StringComparison.Ordinal);
        Assert.StartsWith($"alarm rule file '{Path.Combine(_dir, "missing.json")}': ", set.Errors[2], StringComparison.Ordinal);
    }
}
