using SoftSensor.Core.Gas;

namespace SoftSensor.Core.Tests.Gas;

public class OxygenSolubilityTests
{
    // Benson & Krause 1984 (Limnol. Oceanogr. 29, 620), as tabulated by USGS (Office of Water
    // Quality Technical Memorandum 2011.03, DO tables) and in docs/methods.md §1.6: fresh water, 1 atm,
    // water-saturated air: 9.09 (20 °C), 8.26 (25 °C), 7.56 (30 °C), 6.73 mg/L (37 °C), to 0.01 mg/L.
    [Theory]
    [InlineData(20.0, 9.09)]
    [InlineData(25.0, 8.26)]
    [InlineData(30.0, 7.56)]
    [InlineData(37.0, 6.73)]
    public void FreshWaterAtOneAtmosphereMgPerL_matches_Benson_Krause_table(double temperatureC, double expected)
    {
        Assert.Equal(expected, OxygenSolubility.FreshWaterAtOneAtmosphereMgPerL(temperatureC), 0.005);
    }

    [Fact]
    public void SaturationMgPerL_at_air_partial_pressure_reproduces_one_atmosphere_value()
    {
        // Henry's law: at pO2 = 0.20946 (101.325 - p_sat(30 °C)) kPa the scaled value is the 1-atm value.
        double pO2 = 0.20946 * (101.325 - WaterVapour.SaturationPressureKPa(303.15));
        Assert.Equal(OxygenSolubility.FreshWaterAtOneAtmosphereMgPerL(30), OxygenSolubility.SaturationMgPerL(30, pO2, 1.0), 12);
        Assert.Equal(2 * 0.9 * OxygenSolubility.FreshWaterAtOneAtmosphereMgPerL(30), OxygenSolubility.SaturationMgPerL(30, 2 * pO2, 0.9), 12);
    }

    [Fact]
    public void FreshWaterAtOneAtmosphereMgPerL_outside_0_to_40_C_is_NaN()
    {
        Assert.True(double.IsNaN(OxygenSolubility.FreshWaterAtOneAtmosphereMgPerL(45)));
    }
}
