using StringModes.Reporting.Model;
using StringModes.Reporting.Tests.Figures;

namespace StringModes.Reporting.Tests.Support;

/// <summary>
/// An invented report (demo scenario, not a measurement). String properties and the tension budget use the
/// worked case of REFERENCES.md §8 [computed]: T = 4μL²f², μ = 1.000 g/m ± 1 %, L = 0.650 ± 0.001 m,
/// f = 100.0 ± 0.1 Hz → T = 16.900 N, u(T) = 0.18002 N.
/// </summary>
internal static class DemoReport
{
    public static ReportModel Model(string clipName = "bench-nylon-demo.mkv")
    {
        const double t = 16.9;
        var modes = DemoScenario.Modes.Select((n, m) => new ModeRow(
            n,
            new MeasuredValue(n * 100.0 + 0.0004 * n * n, 0.0031 * n),
            new MeasuredValue(DemoScenario.DecayRatesPerS[m], 0.012),
            new MeasuredValue(DemoScenario.DecayRatesPerS[m] / (2 * Math.PI * n * 100), 2e-5),
            new MeasuredValue(Math.PI * n * 100 / DemoScenario.DecayRatesPerS[m], 1.5),
            new MeasuredValue(DemoScenario.AmplitudesM[m], 2e-6),
            new MeasuredValue(1 + 4e-6 * (n * n - 1), n == 1 ? 0 : 3e-5))).ToArray();
        var field = DemoScenario.Field(count: 200);
        return new ReportModel
        {
            Measurement = new MeasurementSummary
            {
                ClipName = clipName,
                SpecimenDescription = "a nylon monofilament (invented demo data)",
                Frames = 1200,
                CaptureFps = 240,
                DurationS = 5,
                AnalysisWindowStartS = 0.3,
                AnalysisWindowEndS = 2.5,
                MarkCount = 9,
            },
            Modes = modes,
            StringProperties = new StringProperties
            {
                LengthM = new MeasuredValue(0.65, 0.001),
                LinearDensityKgPerM = new MeasuredValue(1e-3, 1e-5),
                FundamentalHz = new MeasuredValue(100.0, 0.1),
                Inharmonicity = new MeasuredValue(4.1e-6, 1.3e-6),
                WaveSpeedMPerS = new MeasuredValue(130.0, 0.7),
                TensionN = new MeasuredValue(t, 0.18002),
            },
            Budget = new UncertaintyBudget("Tension T", "N", new MeasuredValue(t, 0.18002),
            [
                new BudgetRow("Length L", "m", new MeasuredValue(0.65, 0.001), 2 * t / 0.65),
                new BudgetRow("Linear density μ", "kg/m", new MeasuredValue(1e-3, 1e-5), t / 1e-3),
                new BudgetRow("Fundamental f₀", "Hz", new MeasuredValue(100.0, 0.1), 2 * t / 100.0),
            ]),
            Checks =
            [
                new CheckRow("2nd harmonic at 2× fundamental", true, "f₂/(2·f₁) = 1.000012 ± 0.000030"),
                new CheckRow("Modes above half the frame rate", false, "modes 2–6 lie above 120 Hz and were read through aliasing"),
            ],
            Warnings =
            [
                new ReportWarning("The envelope of mode 3 bends: two close frequencies are beating.", "Fit both polarisations or film from a second direction; treat the decay rate of mode 3 with caution."),
                new ReportWarning("Text with <markup> & \"quotes\" is shown literally.", "Nothing; this checks escaping."),
            ],
            Settings =
            [
                new SettingRow("Modes fitted", "1–6"),
                new SettingRow("Frequency estimator", "interpolated FFT seed, nonlinear least squares"),
            ],
            Figures = new ReportFigureData
            {
                ModeAmplitudes = DemoScenario.Envelopes(),
                Displacement = field,
                Spectra = SpectrumFigureTests.Spectra(),
                Decays = DecayFigureTests.Decays(),
                HarmonicRatios = HarmonicRatioFigureTests.Points(),
                Inharmonicity = 3.88453e-4,
            },
            Generator = "stringmodes (test build)",
        };
    }
}
