using SoftSensor.Simulation.Kinetics;

namespace SoftSensor.Simulation.Vessel;

/// <summary>Everything the model computes at one instant besides the derivatives: the truth of a row.</summary>
public readonly record struct ReactorSnapshot(
    CultureRates Culture,
    double OtrMmolPerLh,
    double CtrMmolPerLh,
    double KlaPerH,
    double FeedLPerH,
    double BaseLPerH,
    double EvaporationLPerH,
    double InletMolPerH,
    double OutletMolPerH,
    double InletO2Fraction,
    double InletCo2Fraction,
    double HeadspaceMol,
    double OxygenSaturationMmolPerL,
    double DissolvedCo2MmolPerL);
