namespace SoftSensor.Simulation.Vessel;

/// <summary>Positions in the integrated state vector (amounts in the vessel and running totals).</summary>
internal static class StateIndex
{
    public const int VolumeL = 0;
    public const int BiomassG = 1;
    public const int SubstrateG = 2;
    public const int ByproductG = 3;
    public const int OverflowG = 4;
    /// <summary>Dissolved O2, mmol/L.</summary>
    public const int OxygenMmolPerL = 5;
    /// <summary>Total inorganic carbon (CO2 + HCO3- + CO3--), mmol/L.</summary>
    public const int TicMmolPerL = 6;
    /// <summary>Headspace O2 mole fraction, dry basis.</summary>
    public const int HeadspaceO2 = 7;
    /// <summary>Headspace CO2 mole fraction, dry basis.</summary>
    public const int HeadspaceCo2 = 8;
    /// <summary>Running total of substrate carbon fed, C-mmol.</summary>
    public const int CarbonFedCmmol = 9;
    /// <summary>Running total of CO2 out minus CO2 in with the gas, mmol.</summary>
    public const int Co2NetOutMmol = 10;
    /// <summary>Running total of inert gas in minus out, mmol (equals the headspace inert change).</summary>
    public const int InertInMinusOutMmol = 11;
    public const int FeedL = 12;
    public const int BaseL = 13;
    public const int EvaporatedL = 14;
    /// <summary>Running total of inert gas in, mmol.</summary>
    public const int InertInMmol = 15;
    public const int Count = 16;
}
