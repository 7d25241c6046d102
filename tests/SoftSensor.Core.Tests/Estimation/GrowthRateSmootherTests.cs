using SoftSensor.Core.Estimation;

namespace SoftSensor.Core.Tests.Estimation;

public class GrowthRateSmootherTests
{
    [Fact]
    public void Smooth_step_response_after_one_time_constant_reaches_63_percent()
    {
        // First-order lag: y(tau) = 1 - exp(-1) = 0.632 of a unit step (common practice), independent of the step size.
        foreach (int steps in new[] { 1, 10, 1000 })
        {
            double y = 0.0;
            for (int i = 0; i < steps; i++)
            {
                y = GrowthRateSmoother.Smooth(y, 1.0, 0.5 / steps, 0.5);
            }

            Assert.Equal(1 - Math.Exp(-1), y, 12);
        }
    }

    [Fact]
    public void Smooth_with_unknown_raw_value_holds_the_previous_value()
    {
        Assert.Equal(0.2, GrowthRateSmoother.Smooth(0.2, double.NaN, 1, 0.5));
        Assert.Equal(0.3, GrowthRateSmoother.Smooth(double.NaN, 0.3, 1, 0.5));
        Assert.True(double.IsNaN(GrowthRateSmoother.RawMuPerH(1, 0)));
    }
}
