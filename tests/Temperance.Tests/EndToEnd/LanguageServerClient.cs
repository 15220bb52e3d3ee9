using System.Collections.Concurrent;
using System.Diagnostics;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;

namespace Temperance.Tests.EndToEnd;

/// <summary>
/// A minimal LSP client: JSON-RPC 2.0 over the server's stdio, each message framed by a Content-Length header.
/// It answers the server's own requests (workspace/configuration and the like) and keeps the server's log and
/// notifications so a failing test can show what the server said.
/// </summary>
public sealed class LanguageServerClient : IDisposable
{
    private readonly Process process;
    private readonly Stream input;
    private readonly Func<string, JsonNode?, JsonNode?> answerServerRequest;
    private readonly ConcurrentDictionary<int, TaskCompletionSource<JsonElement>> pending = new();
    private readonly StringBuilder log = new();
    private readonly object writeLock = new();
    private int nextId;

    /// <param name="answerServerRequest">The result for a request the server sends (method, params); null answers null.</param>
    public LanguageServerClient(string executable, string arguments, string workingDirectory,
        IDictionary<string, string> environment, Func<string, JsonNode?, JsonNode?> answerServerRequest)
    {
        this.answerServerRequest = answerServerRequest;
        var start = new ProcessStartInfo(executable, arguments)
        {
            WorkingDirectory = workingDirectory,
            RedirectStandardInput = true,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        foreach (var (key, value) in environment)
        {
            start.Environment[key] = value;
        }

        process = Process.Start(start) ?? throw new InvalidOperationException($"could not start {executable}");
        input = process.StandardInput.BaseStream;
        process.ErrorDataReceived += (_, e) => { if (e.Data != null) { Log("stderr: " + e.Data); } };
        process.BeginErrorReadLine();
        new Thread(ReadLoop) { IsBackground = true, Name = "lsp-reader" }.Start();
    }

    /// <summary>Everything the server logged or notified, for assertion messages.</summary>
    public string ServerLog
    {
        get { lock (log) { return log.ToString(); } }
    }

    public async Task<JsonElement> Request(string method, object? parameters, TimeSpan timeout)
    {
        var id = Interlocked.Increment(ref nextId);
        var response = new TaskCompletionSource<JsonElement>(TaskCreationOptions.RunContinuationsAsynchronously);
        pending[id] = response;
        Send(new JsonObject { ["jsonrpc"] = "2.0", ["id"] = id, ["method"] = method, ["params"] = ToNode(parameters) });
        try
        {
            return await response.Task.WaitAsync(timeout);
        }
        catch (TimeoutException)
        {
            throw new TimeoutException($"{method} got no answer in {timeout.TotalSeconds:0}s. Server said:\n{ServerLog}");
        }
        finally
        {
            pending.TryRemove(id, out _);
        }
    }

    public void Notify(string method, object? parameters) =>
        Send(new JsonObject { ["jsonrpc"] = "2.0", ["method"] = method, ["params"] = ToNode(parameters) });

    public void Dispose()
    {
        try
        {
            // A polite shutdown, briefly; whatever is left of the server is killed below.
            if (!process.HasExited)
            {
                Request("shutdown", null, TimeSpan.FromSeconds(10)).GetAwaiter().GetResult();
                Notify("exit", null);
                process.WaitForExit(5000);
            }
        }
        catch (Exception e) when (e is TimeoutException or IOException or InvalidOperationException)
        {
        }
        finally
        {
            if (!process.HasExited)
            {
                process.Kill(entireProcessTree: true);
            }

            process.Dispose();
        }
    }

    private static JsonNode? ToNode(object? value) => value as JsonNode ?? JsonSerializer.SerializeToNode(value);

    private void Send(JsonObject message)
    {
        var body = Encoding.UTF8.GetBytes(message.ToJsonString());
        var header = Encoding.ASCII.GetBytes($"Content-Length: {body.Length}\r\n\r\n");
        lock (writeLock)
        {
            input.Write(header);
            input.Write(body);
            input.Flush();
        }
    }

    private void Log(string line)
    {
        lock (log)
        {
            log.AppendLine(line);
        }
    }

    private void ReadLoop()
    {
        var output = process.StandardOutput.BaseStream;
        try
        {
            while (ReadMessage(output) is { } message)
            {
                Dispatch(message);
            }
        }
        catch (Exception e) when (e is IOException or ObjectDisposedException or JsonException)
        {
            Log("reader stopped: " + e.Message);
        }

        // The server is gone: nothing pending will be answered.
        foreach (var waiting in pending.Values)
        {
            waiting.TrySetException(new IOException("the language server closed its output. Server said:\n" + ServerLog));
        }
    }

    private void Dispatch(JsonElement message)
    {
        var hasId = message.TryGetProperty("id", out var id);
        if (!message.TryGetProperty("method", out var methodElement))
        {
            // A response to one of our requests.
            if (hasId && id.ValueKind == JsonValueKind.Number && pending.TryGetValue(id.GetInt32(), out var waiting))
            {
                if (message.TryGetProperty("error", out var error))
                {
                    waiting.TrySetException(new InvalidOperationException("server error: " + error.GetRawText()));
                }
                else
                {
                    waiting.TrySetResult(message.TryGetProperty("result", out var result) ? result.Clone() : default);
                }
            }

            return;
        }

        var method = methodElement.GetString()!;
        var parameters = message.TryGetProperty("params", out var p) ? JsonNode.Parse(p.GetRawText()) : null;
        Log(method + (method == "textDocument/publishDiagnostics" ? "" : ": " + parameters?.ToJsonString()));
        if (hasId)
        {
            // A request from the server: it waits for our answer (the configuration pull at "initialized" does).
            Send(new JsonObject
            {
                ["jsonrpc"] = "2.0",
                ["id"] = JsonNode.Parse(id.GetRawText()),
                ["result"] = answerServerRequest(method, parameters),
            });
        }
    }

    /// <summary>One framed message, or null at the end of the stream.</summary>
    private static JsonElement? ReadMessage(Stream stream)
    {
        var length = -1;
        while (true)
        {
            var line = ReadHeaderLine(stream);
            if (line == null)
            {
                return null;
            }

            if (line.Length == 0)
            {
                break;
            }

            if (line.StartsWith("Content-Length:", StringComparison.OrdinalIgnoreCase))
            {
                length = int.Parse(line["Content-Length:".Length..].Trim(), System.Globalization.CultureInfo.InvariantCulture);
            }
        }

        if (length < 0)
        {
            throw new IOException("message without Content-Length");
        }

        var body = new byte[length];
        stream.ReadExactly(body);
        using var document = JsonDocument.Parse(body);
        return document.RootElement.Clone();
    }

    private static string? ReadHeaderLine(Stream stream)
    {
        var bytes = new List<byte>();
        while (true)
        {
            var b = stream.ReadByte();
            if (b < 0)
            {
                return null;
            }

            if (b == '\n')
            {
                return Encoding.ASCII.GetString(bytes.ToArray()).TrimEnd('\r');
            }

            bytes.Add((byte)b);
        }
    }
}
