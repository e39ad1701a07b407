using System.Diagnostics;

namespace StringModes.Cli;

/// <summary>A one-line progress bar with rate and time left on stderr, drawn only when stderr is a terminal.</summary>
internal sealed class ProgressBar(App app, string label, string unit, double total) : IProgress<double>
{
    private readonly Stopwatch _clock = Stopwatch.StartNew();
    private long _lastDrawMs = -1000;

    public void Report(double fraction)
    {
        if (!app.Interactive) return;
        var ms = _clock.ElapsedMilliseconds;
        if (ms - _lastDrawMs < 200 && fraction < 1) return;
        _lastDrawMs = ms;
        var done = fraction * total;
        var rate = done / Math.Max(1e-3, _clock.Elapsed.TotalSeconds);
        var left = rate > 0 ? (total - done) / rate : 0;
        const int width = 28;
        var filled = (int)Math.Round(Math.Clamp(fraction, 0, 1) * width);
        app.Error.Write($"\r{label} [{new string('#', filled)}{new string('.', width - filled)}] {fraction * 100,5:F1}%  {rate:F0} {unit}/s  {left:F0} s left ");
        if (fraction >= 1) app.Error.WriteLine();
    }
}
