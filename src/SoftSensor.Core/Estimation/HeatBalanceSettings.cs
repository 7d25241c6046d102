namespace SoftSensor.Core.Estimation;

/// <summary>
/// The jacket heat balance (docs/pathway.md §4): coolant properties, the calibrated heat loss, the
/// stirrer power (measured, or from the speed with a power number) and the oxycaloric equivalent.
/// Units in the names.
/// </summary>
public sealed record HeatBalanceSettings
{
    /// <summary>Coolant density, kg/L (0.997: water at 25 °C, CRC Handbook of Chemistry and Physics).</summary>
    public double CoolantDensityKgPerL { get; init; } = 0.997;

    /// <summary>Coolant specific heat capacity, kJ/(kg·K) (4.18: water at 25 °C, CRC Handbook).</summary>
    public double CoolantHeatCapacityKjPerKgK { get; init; } = 4.18;

    /// <summary>Heat lost to the surroundings at the calibration point, W (calibrated before inoculation with the vessel at temperature and no culture).</summary>
    public double HeatLossW { get; init; }

    /// <summary>Change of the loss per kelvin of broth above <see cref="AmbientTemperatureC"/>, W/K (0: a constant loss).</summary>
    public double HeatLossWPerK { get; init; }

    /// <summary>Ambient temperature the loss refers to, °C.</summary>
    public double AmbientTemperatureC { get; init; } = 20;

    /// <summary>Count the heat the off-gas carries away as water vapour (saturated at the broth temperature, from the dry outlet flow of the gas balance); false when a condenser returns it or the loss calibration covers it.</summary>
    public bool EvaporationFromGas { get; init; } = true;

    /// <summary>Latent heat of water, kJ/mol (43.5: 2414 kJ/kg near 37 °C, steam tables; from memory).</summary>
    public double LatentHeatKjPerMol { get; init; } = 43.5;

    /// <summary>Standard uncertainty of the calibrated loss, W.</summary>
    public double HeatLossSigmaW { get; init; } = 20;

    /// <summary>Impeller power number (turbulent regime; about 5 for a Rushton turbine, Rushton, Costich &amp; Everett 1950, Chem. Eng. Prog. 46), for the power from the speed; NaN when the power is measured.</summary>
    public double PowerNumber { get; init; } = double.NaN;

    /// <summary>Impeller diameter, m, and the number of impellers on the shaft (for the power from the speed).</summary>
    public double ImpellerDiameterM { get; init; } = double.NaN;

    /// <inheritdoc cref="ImpellerDiameterM"/>
    public int Impellers { get; init; } = 1;

    /// <summary>Broth density, kg/L (for the power from the speed).</summary>
    public double BrothDensityKgPerL { get; init; } = 1.03;

    /// <summary>Relative standard uncertainty of the stirrer power.</summary>
    public double StirrerPowerRelativeSigma { get; init; } = 0.1;

    /// <summary>Heat released per mol O2 consumed, kJ/mol (460: Thornton's rule at about 115 kJ per mol of electrons; von Stockar &amp; Marison 1989; measured 440-520, Cooney, Wang &amp; Wang 1969, Biotechnol. Bioeng. 11; ranges from memory).</summary>
    public double OxycaloricKjPerMolO2 { get; init; } = 460;

    /// <summary>Relative standard uncertainty of the oxycaloric equivalent (0.04: half the 440-520 spread over 460, from memory).</summary>
    public double OxycaloricRelativeSigma { get; init; } = 0.04;

    /// <summary>Standard uncertainty of each coolant temperature, K, and the coolant flow's relative uncertainty.</summary>
    public double CoolantTemperatureSigmaK { get; init; } = 0.02;

    /// <inheritdoc cref="CoolantTemperatureSigmaK"/>
    public double CoolantFlowRelativeSigma { get; init; } = 0.01;

    /// <summary>Every fault (empty when valid), each naming the field, the value and the expectation.</summary>
    public IReadOnlyList<string> Validate()
    {
        var e = new List<string>();
        EstimatorSettings.Positive(e, "Heat." + nameof(CoolantDensityKgPerL), CoolantDensityKgPerL);
        EstimatorSettings.Positive(e, "Heat." + nameof(CoolantHeatCapacityKjPerKgK), CoolantHeatCapacityKjPerKgK);
        EstimatorSettings.NonNegative(e, "Heat." + nameof(HeatLossSigmaW), HeatLossSigmaW);
        EstimatorSettings.Positive(e, "Heat." + nameof(OxycaloricKjPerMolO2), OxycaloricKjPerMolO2);
        EstimatorSettings.Positive(e, "Heat." + nameof(OxycaloricRelativeSigma), OxycaloricRelativeSigma);
        EstimatorSettings.Positive(e, "Heat." + nameof(CoolantTemperatureSigmaK), CoolantTemperatureSigmaK);
        EstimatorSettings.Positive(e, "Heat." + nameof(CoolantFlowRelativeSigma), CoolantFlowRelativeSigma);
        EstimatorSettings.NonNegative(e, "Heat." + nameof(StirrerPowerRelativeSigma), StirrerPowerRelativeSigma);
        EstimatorSettings.Positive(e, "Heat." + nameof(BrothDensityKgPerL), BrothDensityKgPerL);
        if (!double.IsFinite(HeatLossW) || !double.IsFinite(HeatLossWPerK) || !double.IsFinite(AmbientTemperatureC))
        {
            e.Add($"Heat.{nameof(HeatLossW)}, {nameof(HeatLossWPerK)} and {nameof(AmbientTemperatureC)} are {HeatLossW}, {HeatLossWPerK}, {AmbientTemperatureC}; expected finite numbers");
        }

        if (!double.IsNaN(PowerNumber))
        {
            EstimatorSettings.Positive(e, "Heat." + nameof(PowerNumber), PowerNumber);
            EstimatorSettings.Positive(e, "Heat." + nameof(ImpellerDiameterM), ImpellerDiameterM);
            if (Impellers < 1)
            {
                e.Add($"Heat.{nameof(Impellers)} is {Impellers}; expected 1 or more");
            }
        }

        return e;
    }
}
