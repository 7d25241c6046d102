using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Cli;
using SoftSensor.Daemon.Contracts;
using SoftSensor.Daemon.Pipeline;
using StatusCodes = SoftSensor.OpcUa.Encoding.StatusCodes;

namespace SoftSensor.Daemon.Tests.Demo;

/// <summary>The demo's console lines (invented values): units once in the header, a reason after each uncertain or bad line.</summary>
public sealed class CycleConsoleTests
{
    private static readonly DateTimeOffset T = new(2026, 3, 2, 6, 30, 32, TimeSpan.Zero);

    private static EstimateValue V(string name, double value, string unit, SampleQuality q = SampleQuality.Good, uint code = 0) => new(name, value, unit, double.NaN, q, code);

    private static InputHealth Input(string tag, InputState state, SampleQuality q, double age = 1) =>
        new(tag, SignalRole.OutletO2Percent, 20.5, T, age, state, q, q == SampleQuality.Good ? 0u : q == SampleQuality.Bad ? StatusCodes.Bad : StatusCodes.Uncertain);

    [Fact]
    public void Header_names_each_column_with_its_unit_and_a_good_line_carries_numbers_only()
    {
        Assert.Equal("time (UTC)           reactor   cycle  OUR mmol/(L·h)  CER mmol/(L·h)  RQ mol/mol    µ 1/h  biomass g/L  quality", CycleConsole.Header());
        var frame = new EstimateFrame("r1", "b", T, SampleQuality.Good,
            [V(EstimateNames.Our, 6.159, "mmol/(L·h)"), V(EstimateNames.Cer, 4.119, "mmol/(L·h)"), V(EstimateNames.Rq, 0.669, "mol/mol"), V(EstimateNames.MuPerH, 0.325, "1/h"), V(EstimateNames.BiomassGPerL, 0.382, "g/L")]);
        string line = CycleConsole.Line(new ReactorSnapshot("r1", 181, T, frame, [Input("R1.OFFGAS.O2", InputState.Ok, SampleQuality.Good)]));
        Assert.Equal("2026-03-02T06:30:32Z r1          181           6.159           4.119       0.669    0.325        0.382  good", line);
        Assert.Equal(CycleConsole.Header().IndexOf("quality", StringComparison.Ordinal), line.IndexOf("good", StringComparison.Ordinal));
    }

    [Fact]
    public void A_bad_line_names_the_inputs_still_waiting_and_the_stale_ones()
    {
        var frame = new EstimateFrame("r1", "b", T, SampleQuality.Bad, [V(EstimateNames.Our, double.NaN, "mmol/(L·h)", SampleQuality.Bad, StatusCodes.BadWaitingForInitialData)]);
        var s = new ReactorSnapshot("r1", 2, T, frame, [Input("R1.OFFGAS.O2", InputState.Waiting, SampleQuality.Bad), Input("R1.AIR.FLOW", InputState.Stale, SampleQuality.Bad, 75)]);
        Assert.EndsWith("bad: no value yet from R1.OFFGAS.O2; R1.AIR.FLOW stale (75 s old)", CycleConsole.Line(s), StringComparison.Ordinal);
    }

    [Fact]
    public void An_uncertain_line_says_the_balance_test_failed_with_h_and_its_limit()
    {
        var frame = new EstimateFrame("r1", "b", T, SampleQuality.Uncertain,
            [V(EstimateNames.Our, 90, "mmol/(L·h)", SampleQuality.Uncertain, StatusCodes.UncertainSubNormal), V(EstimateNames.ConsistencyH, 12.34, "1"), V(EstimateNames.ConsistencyCritical, 7.815, "1")]);
        var s = new ReactorSnapshot("r1", 9, T, frame, [Input("R1.OFFGAS.O2", InputState.Ok, SampleQuality.Good)]);
        Assert.EndsWith("uncertain: balance test failed (h 12.3 > 7.8): a measurement or the model is off", CycleConsole.Line(s), StringComparison.Ordinal);
    }

    [Fact]
    public void An_uncertain_line_without_a_known_cause_names_the_status_code()
    {
        var frame = new EstimateFrame("r1", "b", T, SampleQuality.Uncertain, [V(EstimateNames.Our, 90, "mmol/(L·h)", SampleQuality.Uncertain, StatusCodes.UncertainSensorNotAccurate)]);
        var s = new ReactorSnapshot("r1", 9, T, frame, []);
        Assert.EndsWith("uncertain: UncertainSensorNotAccurate", CycleConsole.Line(s), StringComparison.Ordinal);
    }
}
