using System.Diagnostics;
using System.Text;

namespace Temperance.Tests.EndToEnd;

/// <summary>Runs the real dotnet CLI (build, pack, format) as a client of the packed analyzer.</summary>
public static class DotNet
{
    public sealed record Result(int ExitCode, string Output)
    {
        public override string ToString() => $"exit {ExitCode}\n{Output}";
    }

    public static Result Run(string workingDirectory, string arguments, IDictionary<string, string>? environment = null, int timeoutSeconds = 600)
    {
        var start = new ProcessStartInfo("dotnet", arguments)
        {
            WorkingDirectory = workingDirectory,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        start.Environment["DOTNET_CLI_TELEMETRY_OPTOUT"] = "1";
        start.Environment["DOTNET_NOLOGO"] = "1";
        start.Environment["MSBUILDDISABLENODEREUSE"] = "1";
        if (environment != null)
        {
            foreach (var (key, value) in environment)
            {
                start.Environment[key] = value;
            }
        }

        var output = new StringBuilder();
        using var process = new Process { StartInfo = start };
        process.OutputDataReceived += (_, e) => { if (e.Data != null) { lock (output) { output.AppendLine(e.Data); } } };
        process.ErrorDataReceived += (_, e) => { if (e.Data != null) { lock (output) { output.AppendLine(e.Data); } } };
        process.Start();
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();
        if (!process.WaitForExit(timeoutSeconds * 1000))
        {
            process.Kill(entireProcessTree: true);
            throw new TimeoutException($"dotnet {arguments} did not finish in {timeoutSeconds}s:\n{output}");
        }

        process.WaitForExit();
        lock (output)
        {
            return new Result(process.ExitCode, output.ToString());
        }
    }
}
