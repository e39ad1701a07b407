namespace StringModes.Reporting.Model;

/// <summary>A measured quantity and its standard uncertainty (k = 1), in the unit named by the property holding it.</summary>
public readonly record struct MeasuredValue(double Value, double StandardUncertainty);
