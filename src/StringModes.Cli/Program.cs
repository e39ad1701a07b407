namespace StringModes.Cli;

internal static class Program
{
    private static int Main(string[] args)
    {
        using var cancel = new CancellationTokenSource();
        Console.CancelKeyPress += (_, e) =>
        {
            e.Cancel = true;
            cancel.Cancel();
        };
        using var sigterm = System.Runtime.InteropServices.PosixSignalRegistration.Create(
            System.Runtime.InteropServices.PosixSignal.SIGTERM, c =>
            {
                c.Cancel = true;
                cancel.Cancel();
            });
        var app = new App(Console.Out, Console.Error, Environment.GetEnvironmentVariable("NO_COLOR") is { Length: > 0 },
            !Console.IsErrorRedirected);
        return app.Run(args, cancel.Token);
    }
}
