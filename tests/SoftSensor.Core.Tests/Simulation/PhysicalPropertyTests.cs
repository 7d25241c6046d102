using SoftSensor.Simulation.Gas;

namespace SoftSensor.Core.Tests.Simulation;

public class PhysicalPropertyTests
{
    // IAPWS R7-97(2012), Table 35 (verification values of the saturation-pressure equation):
    // p_s(300 K) = 3.53658941e-3 MPa, p_s(500 K) = 2.63889776 MPa, p_s(600 K) = 12.3443146 MPa.
    [Theory]
    [InlineData(300.0, 3.53658941)]
    [InlineData(500.0, 2638.89776)]
    [InlineData(600.0, 12344.3146)]
    public void SaturationPressureKPa_matches_the_IAPWS_IF97_verification_table(double t, double expectedKPa)
    {
        Assert.Equal(expectedKPa, WaterVapour.SaturationPressureKPa(t), expectedKPa * 1e-8);
    }

    // Benson & Krause 1984 as tabulated by USGS (DOTABLES) and docs/methods.md §1.6: fresh water,
    // 1 atm moist air: 9.09 mg/L at 20 °C, 8.26 at 25 °C, 7.56 at 30 °C, 6.73 at 37 °C (to ±0.01).
    [Theory]
    [InlineData(20.0, 9.09)]
    [InlineData(25.0, 8.26)]
    [InlineData(30.0, 7.56)]
    [InlineData(37.0, 6.73)]
    public void AirSaturatedFreshWaterMgPerL_matches_Benson_and_Krause(double tC, double expected)
    {
        Assert.Equal(expected, OxygenSolubility.AirSaturatedFreshWaterMgPerL(tC + 273.15), 0.006);
    }

    [Fact]
    public void Pk1_matches_Harned_and_Davis_at_25_and_37_C()
    {
        // Harned & Davis 1943 via docs/methods.md §1.5: pK1 = 6.351 at 25 °C and 6.303 at 37 °C.
        Assert.Equal(6.351, CarbonateEquilibrium.Pk1(298.15), 0.002);
        Assert.Equal(6.303, CarbonateEquilibrium.Pk1(310.15), 0.002);
    }
}
