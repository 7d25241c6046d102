namespace SoftSensor.Simulation.Scenarios;

// Scenario keys of the culture's own energetics and of the jacket (docs/pathway.md §6).

/// <summary>
/// The simulated culture's own energy budget: when given, its Pirt yield and maintenance follow from
/// its P/O ratio, ATP demand for growth, maintenance ATP, substrate-level ATP and anabolic CO2
/// (and its own biomass composition), and the P/O ratio may step during the run. A culture set up
/// like the estimator's pathway model proves nothing: give it values of its own.
/// </summary>
public sealed record EnergeticsSpec
{
    /// <summary>P/O ratio, mol ATP per mol O atoms respired, at the start.</summary>
    public double PoRatio { get; init; } = 2.0;

    /// <summary>ATP used per C-mol biomass made, mol/C-mol.</summary>
    public double AtpPerBiomassCmol { get; init; } = 2.6;

    /// <summary>Maintenance ATP, mmol/(g dry weight·h).</summary>
    public double MaintenanceAtpMmolPerGH { get; init; } = 2.4;

    /// <summary>Substrate-level ATP per C-mol substrate fully oxidised, mol/C-mol.</summary>
    public double SubstrateLevelAtpPerCmol { get; init; } = 0.62;

    /// <summary>CO2 released by anabolism per C-mol biomass, C-mol/C-mol.</summary>
    public double AnabolicCo2PerBiomassCmol { get; init; } = 0.22;

    /// <summary>Later P/O ratios (uncoupling, stress), each from its hour on.</summary>
    public IReadOnlyList<PoStep> PoSteps { get; init; } = [];
}

/// <summary>A P/O ratio from <see cref="AtH"/> on.</summary>
public sealed record PoStep
{
    public double AtH { get; init; }
    public double PoRatio { get; init; }
}

/// <summary>
/// The vessel's cooling jacket and stirrer: the coolant takes the culture's heat (from its enthalpy
/// balance with heats of combustion), the stirrer power, minus the losses to the room, the
/// evaporation and the warming of the feed. Instruments with their own noise.
/// </summary>
public sealed record JacketSpec
{
    public double CoolantFlowLPerH { get; init; } = 300;
    public double CoolantInletC { get; init; } = 15;
    public double StirrerPowerW { get; init; } = 150;
    /// <summary>Loss to the room per kelvin of broth above ambient, W/K.</summary>
    public double LossWPerK { get; init; } = 3.0;
    public double AmbientC { get; init; } = 20;
    /// <summary>Feed temperature, °C (the feed is warmed to the broth temperature).</summary>
    public double FeedC { get; init; } = 20;
    /// <summary>Heats of combustion, kJ per C-mol, of the substrate, the by-product and the overflow product (tabulated values; NaN: from the degree of reduction with <see cref="BiomassKjPerElectronMol"/>).</summary>
    public double SubstrateKjPerCmol { get; init; } = double.NaN;
    public double ByproductKjPerCmol { get; init; } = double.NaN;
    public double OverflowKjPerCmol { get; init; } = double.NaN;
    /// <summary>Heat of combustion of biomass per mol of electrons, kJ (about 111; Patel &amp; Erickson 1981, Biotechnol. Bioeng. 23; from memory).</summary>
    public double BiomassKjPerElectronMol { get; init; } = 111;
    public double TemperatureNoiseC { get; init; } = 0.02;
    public double FlowGainSd { get; init; } = 0.01;
    public double FlowNoiseLPerH { get; init; } = 1.0;
    public double PowerNoiseW { get; init; } = 3;
}
