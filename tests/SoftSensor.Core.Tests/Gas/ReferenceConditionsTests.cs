using SoftSensor.Core.Gas;

namespace SoftSensor.Core.Tests.Gas;

public class ReferenceConditionsTests
{
    // CODATA 2018 (NIST CODATA "molar volume of ideal gas (273.15 K, 101.325 kPa)" 22.413 969 54e-3
    // m³/mol and "(273.15 K, 100 kPa)" 22.710 954 64e-3 m³/mol, both exact to the digits shown since
    // R = 8.314 462 618 J/(mol K) is exact in the 2019 SI).
    [Theory]
    [InlineData(101.325, 22.41396954)]
    [InlineData(100.0, 22.71095464)]
    public void MolarVolumeLPerMol_at_0_C_matches_CODATA_2018(double pressureKPa, double expected)
    {
        var reference = ReferenceConditions.FromCelsius(0, pressureKPa);
        Assert.Equal(expected, reference.MolarVolumeLPerMol, 8);
    }

    [Fact]
    public void MolarVolumeLPerMol_at_20_C_scales_with_absolute_temperature()
    {
        // Ideal gas: V_m(20 °C) / V_m(0 °C) = 293.15 / 273.15 at the same pressure.
        double ratio = ReferenceConditions.FromCelsius(20, 101.325).MolarVolumeLPerMol / ReferenceConditions.Normal.MolarVolumeLPerMol;
        Assert.Equal(293.15 / 273.15, ratio, 14);
    }

    [Theory]
    [InlineData(-300.0, 101.325)]
    [InlineData(0.0, 0.0)]
    [InlineData(0.0, double.NaN)]
    public void IsValid_for_unphysical_conditions_is_false(double temperatureC, double pressureKPa)
    {
        Assert.False(ReferenceConditions.FromCelsius(temperatureC, pressureKPa).IsValid);
    }
}
