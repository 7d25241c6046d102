namespace SoftSensor.Core.Gas;

/// <summary>
/// The intermediate molar flows (mol/h) of one inert balance, shared by the rates and their
/// uncertainty. Each gas line i carries N_i with O2 fraction a_i and CO2 fraction c_i: the line's
/// own composition when the inlet is mixed from the lines, the measured inlet composition when a
/// reference reading is used (then every line is taken to carry the measured mix).
/// </summary>
internal readonly struct BalanceState
{
    public BalanceState(in GasLineFlows flows, in InletComposition inlet, double outletO2Dry, double outletCo2Dry, double water, double molarVolumeLPerMol)
    {
        // n_dot [mol/h] = F [L/min] * 60 / V_m (docs/methods.md §1.1).
        double perNl = 60.0 / molarVolumeLPerMol;
        AirMolPerH = flows.AirNlPerMin * perNl;
        OxygenMolPerH = flows.OxygenNlPerMin * perNl;
        NitrogenMolPerH = flows.NitrogenNlPerMin * perNl;
        CarbonDioxideMolPerH = flows.CarbonDioxideNlPerMin * perNl;
        InletMolPerH = AirMolPerH + OxygenMolPerH + NitrogenMolPerH + CarbonDioxideMolPerH;
        IsMeasuredInlet = inlet.Source == InletSource.Measured;
        if (IsMeasuredInlet)
        {
            MeasuredO2 = inlet.O2Fraction;
            MeasuredCo2 = inlet.Co2Fraction;
            O2InMolPerH = InletMolPerH * inlet.O2Fraction;
            Co2InMolPerH = InletMolPerH * inlet.Co2Fraction;
        }
        else
        {
            AirCo2 = inlet.AirCo2Fraction;
            O2InMolPerH = (AirMolPerH * DryAir.O2Fraction) + OxygenMolPerH;
            Co2InMolPerH = (AirMolPerH * inlet.AirCo2Fraction) + CarbonDioxideMolPerH;
        }

        InertInMolPerH = InletMolPerH - O2InMolPerH - Co2InMolPerH;
        OutletO2Fraction = outletO2Dry;
        OutletCo2Fraction = outletCo2Dry;
        OutletInertFraction = 1 - outletO2Dry - outletCo2Dry;
        WaterFraction = water;
        MolarVolumeLPerMol = molarVolumeLPerMol;

        // Inert balance (docs/methods.md §1.3).
        OutletMolPerH = InertInMolPerH / OutletInertFraction;
        OtrMolPerH = O2InMolPerH - (OutletMolPerH * outletO2Dry);
        CtrMolPerH = (OutletMolPerH * outletCo2Dry) - Co2InMolPerH;
    }

    public double AirMolPerH { get; }
    public double OxygenMolPerH { get; }
    public double NitrogenMolPerH { get; }
    public double CarbonDioxideMolPerH { get; }
    public double InletMolPerH { get; }
    public bool IsMeasuredInlet { get; }
    public double MeasuredO2 { get; }
    public double MeasuredCo2 { get; }
    public double AirCo2 { get; }
    public double O2InMolPerH { get; }
    public double Co2InMolPerH { get; }
    public double InertInMolPerH { get; }
    public double OutletO2Fraction { get; }
    public double OutletCo2Fraction { get; }
    public double OutletInertFraction { get; }
    public double WaterFraction { get; }
    public double MolarVolumeLPerMol { get; }
    public double OutletMolPerH { get; }
    public double OtrMolPerH { get; }
    public double CtrMolPerH { get; }
}
