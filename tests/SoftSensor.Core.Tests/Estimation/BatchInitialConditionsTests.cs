using SoftSensor.Core.Estimation;
using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Tests.Estimation;

/// <summary>
/// A state made from a batch's initial conditions starts its integrals from them. The expected
/// values follow from the definitions: X·V = X0·V0 and the observers' initial covariance
/// P0 = (sigma_X0·V0)² (the Kalman filter's initial covariance is the variance of the initial
/// estimate; Simon 2006, Optimal State Estimation, chapter 5, from memory), substrate S0·V0.
/// </summary>
public class BatchInitialConditionsTests
{
    [Fact]
    public void NewState_with_initial_conditions_starts_biomass_covariance_volume_and_substrate_from_them()
    {
        var s = EstimationFixtures.Settings();
        var state = new EstimatorState(s.HistoryCapacity) { Initial = new BatchInitialConditions(40, 0.3, 0.05, 20) };
        var o = new CycleOutputs();
        var t = EstimationFixtures.Start;
        var inputs = new AlignedInputs { Time = t }; // no volume or weight signal: the stated volume is used
        EstimationStep.Run(inputs, EstimationFixtures.Rates(0.1, 0.3, s), state, s, o);

        Assert.Equal(40, o.VolumeL, 12);
        Assert.Equal(0.3 * 40, state.Observers.BiomassG, 12);
        Assert.Equal(0.05 * 40 * 0.05 * 40, state.Observers.BiomassVarG2, 12);
        // The filter already took its first OUR measurement update, which can only shrink P0.
        Assert.InRange(state.Observers.EkfP00, 1e-9, 0.05 * 40 * 0.05 * 40);
        Assert.Equal(0.05, o.BiomassSigmaGPerL, 12);
        Assert.Equal(20 * 40, state.SubstrateG, 9); // first cycle: dt = 0, nothing fed or consumed yet
        Assert.Equal(0, state.SubstrateFedG);
    }

    [Fact]
    public void NewState_without_initial_conditions_uses_the_configured_defaults()
    {
        var s = EstimationFixtures.Settings();
        var state = new EstimatorState(s.HistoryCapacity);
        var o = new CycleOutputs();
        EstimationStep.Run(new AlignedInputs { Time = EstimationFixtures.Start }, EstimationFixtures.Rates(0.1, 1, s), state, s, o);
        Assert.Equal(s.InitialVolumeL, o.VolumeL, 12);
        Assert.Equal(s.InitialBiomassGPerL * s.InitialVolumeL, state.Observers.BiomassG, 12);
    }

    [Fact]
    public void Validate_lists_every_bad_field_with_its_value()
    {
        var errors = new BatchInitialConditions(0, -1, 0, double.NaN).Validate();
        Assert.Equal(4, errors.Count);
        Assert.Contains("VolumeL is 0; expected a finite number > 0", errors);
        Assert.Contains("BiomassGPerL is -1; expected a finite number >= 0", errors);
        Assert.Contains("BiomassSigmaGPerL is 0; expected a finite number > 0", errors);
        Assert.Contains("SubstrateGPerL is NaN; expected a finite number >= 0", errors);
    }

    [Fact]
    public void Codec_keeps_the_initial_conditions_and_still_reads_version_1_states()
    {
        var state = new EstimatorState(8) { Initial = new BatchInitialConditions(40, 0.3, 0.05, 20) };
        Assert.True(EstimatorStateCodec.TryDecode(EstimatorStateCodec.Encode(state), out var back, out var error), error);
        Assert.Equal(state.Initial, back!.Initial);

        // A version 1 state is the version 2 layout without the 33 bytes of initial conditions after the history header
        // (and without version 4's pathway block at the end: 1 + 4 × 8 + 3 × 4 + 64 × (8 + 4) = 813 bytes).
        var v2 = EstimatorStateCodec.Encode(new EstimatorState(8));
        int header = v2.Length - 33 - 813;
        var v1 = v2[..header];
        v1[4] = 1;
        v1[5] = 0;
        Assert.True(EstimatorStateCodec.TryDecode(v1, out var old, out error), error);
        Assert.Null(old!.Initial);
    }
}
