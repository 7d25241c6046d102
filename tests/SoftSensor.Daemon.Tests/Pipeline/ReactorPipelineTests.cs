using System.Diagnostics.Metrics;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Time.Testing;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Pipeline;
using SoftSensor.Daemon.Status;
using SoftSensor.Daemon.Tests.Fixtures;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Tests.Pipeline;

/// <summary>The pipeline on a fake clock: no broker, no sleeps.</summary>
public sealed class ReactorPipelineTests : IDisposable
{
    private static readonly DateTimeOffset T0 = new(2026, 12, 1, 8, 0, 0, TimeSpan.Zero);
    private readonly FakeTimeProvider _time = new(T0);
    private readonly ServiceProvider _sp = new ServiceCollection().AddMetrics().BuildServiceProvider();
    private readonly DaemonMetrics _metrics;
    private readonly ReactorPipeline _pipeline;
    private readonly StatusBoard _board = new();

    public ReactorPipelineTests()
    {
        _metrics = new DaemonMetrics(_sp.GetRequiredService<IMeterFactory>());
        var o = new SoftSensorOptions();
        new ConfigurationBuilder().AddInMemoryCollection(TestConfigs.HandCase(1883, "unit", TimeSpan.FromSeconds(5), "00:00:01")).Build().Bind(o);
        var reactor = o.Reactors[0];
        var bindings = TagBinding.FromOptions(reactor);
        var dispatcher = new FrameDispatcher([], _metrics, _time, NullLogger<FrameDispatcher>.Instance);
        var services = new PipelineServices(_time, dispatcher, _board, null, _metrics, NullLogger.Instance, 10);
        _pipeline = new ReactorPipeline(reactor, bindings, new OffGasCycleFactory().Create(reactor, bindings), [], services);
    }

    public void Dispose()
    {
        _metrics.Dispose();
        _sp.Dispose();
    }

    private void PublishHandCase(SampleQuality o2Quality = SampleQuality.Good, uint o2Code = 0)
    {
        var now = _time.GetUtcNow();
        _pipeline.Accept(new Sample("fic101", 10.0, now, SampleQuality.Good, 0));
        _pipeline.Accept(new Sample("qi201", 19.500, now, o2Quality, o2Code));
        _pipeline.Accept(new Sample("qi202", 1.500, now, SampleQuality.Good, 0));
        _pipeline.Accept(new Sample("li301", 10.0, now, SampleQuality.Good, 0));
    }

    private static EstimateValue Value(EstimateFrame f, string name) => f.Values.Single(v => v.Name == name);

    [Fact]
    public async Task RunCycle_hand_worked_off_gas_case_gives_published_OUR_CER_RQ()
    {
        PublishHandCase();
        var frame = await _pipeline.RunCycleAsync(default);

        // docs/methods.md §6, "an off-gas case worked by hand" (inert balance, recomputed twice independently):
        // 10.0 NL/min dry air (0 °C, 101.325 kPa), V_L 10 L, in 20.946/0.042 %, out 19.500/1.500 % → OTR 38.629, CTR 39.035 mmol/(L·h), RQ 1.0105.
        Assert.Equal(38.629, Value(frame, EstimateNames.Our).Value, 0.0005);
        Assert.Equal(39.035, Value(frame, EstimateNames.Cer).Value, 0.0005);
        Assert.Equal(1.0105, Value(frame, EstimateNames.Rq).Value, 0.00005);
        Assert.Equal(SampleQuality.Good, frame.Quality);
        Assert.Equal(T0, frame.Time);
        Assert.Equal("r1", frame.Reactor);
    }

    [Fact]
    public async Task RunCycle_input_older_than_max_age_turns_bad_within_one_cycle()
    {
        PublishHandCase();
        Assert.Equal(SampleQuality.Good, (await _pipeline.RunCycleAsync(default)).Quality);

        _time.Advance(TimeSpan.FromSeconds(5.5)); // tag max age 5 s: the next cycle must see every input stale
        var frame = await _pipeline.RunCycleAsync(default);

        Assert.Equal(SampleQuality.Bad, frame.Quality);
        Assert.Equal(0x80310000u, Value(frame, EstimateNames.Our).StatusCode); // BadNoCommunication (OPC UA Part 8 §7.3.2)
    }

    [Fact]
    public async Task RunCycle_bad_input_sample_makes_the_estimates_bad_with_its_status_code()
    {
        PublishHandCase(SampleQuality.Bad, 0x808D0000);
        var frame = await _pipeline.RunCycleAsync(default);
        Assert.Equal(SampleQuality.Bad, frame.Quality);
        Assert.Equal(0x808D0000u, Value(frame, EstimateNames.Our).StatusCode);
    }

    [Fact]
    public async Task RunCycle_uncertain_input_makes_the_estimates_uncertain()
    {
        PublishHandCase(SampleQuality.Uncertain, 0x40930000);
        var frame = await _pipeline.RunCycleAsync(default);
        Assert.Equal(SampleQuality.Uncertain, frame.Quality);
        Assert.Equal(0x40930000u, Value(frame, EstimateNames.Our).StatusCode);
        Assert.Equal(38.629, Value(frame, EstimateNames.Our).Value, 0.0005);
    }

    [Fact]
    public async Task RunCycle_before_any_input_is_bad_waiting_for_initial_data()
    {
        var frame = await _pipeline.RunCycleAsync(default);
        Assert.Equal(SampleQuality.Bad, frame.Quality);
        Assert.True(double.IsNaN(Value(frame, EstimateNames.Our).Value));
        Assert.Equal(0x80320000u, Value(frame, EstimateNames.Our).StatusCode);
    }

    [Fact]
    public async Task RunAsync_cycles_on_the_injected_clock_period()
    {
        using var cts = new CancellationTokenSource();
        var run = _pipeline.RunAsync(cts.Token);
        PublishHandCase();
        for (int i = 1; i <= 3; i++)
        {
            await WaitUntilAsync(() => _pipeline.IsWaitingForTick);
            _time.Advance(TimeSpan.FromSeconds(1));
            await WaitUntilAsync(() => _board.Get("r1")?.Cycle == i);
            Assert.Equal(T0.AddSeconds(i), _board.Get("r1")!.CycleTime);
        }

        await cts.CancelAsync();
        await run;
    }

    [Fact]
    public async Task RunAsync_with_cycle_trigger_cycles_on_the_trigger_tag_and_else_after_one_period()
    {
        var o = new SoftSensorOptions();
        var keys = TestConfigs.HandCase(1883, "unit", TimeSpan.FromSeconds(5), "00:00:01");
        keys["reactors:0:cycleTrigger"] = "qi201";
        new ConfigurationBuilder().AddInMemoryCollection(keys).Build().Bind(o);
        var reactor = o.Reactors[0];
        var bindings = TagBinding.FromOptions(reactor);
        var board = new StatusBoard();
        var services = new PipelineServices(_time, new FrameDispatcher([], _metrics, _time, NullLogger<FrameDispatcher>.Instance), board, null, _metrics, NullLogger.Instance, 10);
        var pipeline = new ReactorPipeline(reactor, bindings, new OffGasCycleFactory().Create(reactor, bindings), [], services);
        using var cts = new CancellationTokenSource();
        var run = pipeline.RunAsync(cts.Token);

        await WaitUntilAsync(() => pipeline.IsWaitingForTick);
        var now = _time.GetUtcNow();
        pipeline.Accept(new Sample("fic101", 10.0, now, SampleQuality.Good, 0));
        pipeline.Accept(new Sample("qi202", 1.500, now, SampleQuality.Good, 0));
        pipeline.Accept(new Sample("li301", 10.0, now, SampleQuality.Good, 0));
        Assert.Null(board.Get("r1")); // no trigger yet, the clock has not moved
        pipeline.Accept(new Sample("qi201", 19.500, now, SampleQuality.Good, 0));
        await WaitUntilAsync(() => board.Get("r1")?.Cycle == 1);
        Assert.Equal(T0, board.Get("r1")!.CycleTime); // ran at once, on the trigger, without a tick
        Assert.Equal(38.629, Value(board.Get("r1")!.Frame!, EstimateNames.Our).Value, 0.0005); // docs/methods.md §6 hand case

        await WaitUntilAsync(() => pipeline.IsWaitingForTick);
        _time.Advance(TimeSpan.FromSeconds(1)); // no trigger for one period: the fallback cycle runs
        await WaitUntilAsync(() => board.Get("r1")?.Cycle == 2);
        Assert.Equal(T0.AddSeconds(1), board.Get("r1")!.CycleTime);

        await cts.CancelAsync();
        await run;
    }

    private static async Task WaitUntilAsync(Func<bool> condition)
    {
        // Waits for the pipeline's own task to reach a state; the clock itself is fake.
        for (int i = 0; i < 500 && !condition(); i++)
        {
            await Task.Yield();
            await Task.Delay(2);
        }

        Assert.True(condition());
    }
}
