using System.Diagnostics;
using System.Net.WebSockets;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;

namespace Coupling.Tests.Reports;

/// <summary>
/// Debian's chromium driven headless: installed with apt-get when missing (once per test run, under a lock), started
/// with a fresh profile and no network features, and steered over the DevTools protocol (JSON messages over a WebSocket;
/// Chrome DevTools Protocol, domains Page, Runtime, Log and Network).
/// </summary>
internal static class HeadlessChromium
{
    public const string Executable = "/usr/bin/chromium";

    private static readonly Lock Gate = new();
    private static string? _installLog;

    /// <summary>The switches every start uses: headless, no sandbox (root in a container), no GPU, nothing fetched in the background.</summary>
    private static readonly string[] Switches =
    [
        "--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking",
        "--disable-component-update", "--disable-sync", "--hide-scrollbars", "--mute-audio",
    ];

    /// <summary>Installs chromium with apt-get unless it is there; throws with apt-get's output when that fails.</summary>
    public static void EnsureInstalled()
    {
        lock (Gate)
        {
            if (File.Exists(Executable)) return;
            if (_installLog is null)
            {
                var log = new StringBuilder();
                int code = Run("apt-get", ["install", "-y", "-o", "DPkg::Lock::Timeout=600", "chromium"], log);
                if (code != 0 && !File.Exists(Executable))
                {
                    // The package lists may be missing or stale: refresh them once and try again.
                    Run("apt-get", ["update"], log);
                    code = Run("apt-get", ["install", "-y", "-o", "DPkg::Lock::Timeout=600", "chromium"], log);
                }
                _installLog = $"apt-get exit code {code}\n{log}";
            }
            if (!File.Exists(Executable))
                throw new InvalidOperationException(
                    $"The report test needs Debian's chromium at {Executable}, and 'apt-get install -y chromium' did not provide it " +
                    $"(install it by hand, as root: apt-get install -y chromium). apt-get said:\n{Tail(_installLog, 3000)}");
        }
    }

    private static string Tail(string text, int length) => text.Length <= length ? text : "..." + text[^length..];

    private static int Run(string file, string[] args, StringBuilder log)
    {
        var info = new ProcessStartInfo(file) { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        foreach (var a in args) info.ArgumentList.Add(a);
        info.Environment["DEBIAN_FRONTEND"] = "noninteractive";
        try
        {
            using var p = Process.Start(info)!;
            var stdout = p.StandardOutput.ReadToEndAsync();
            var stderr = p.StandardError.ReadToEndAsync();
            if (!p.WaitForExit(TimeSpan.FromMinutes(20)))
            {
                p.Kill(entireProcessTree: true);
                log.AppendLine($"{file} {string.Join(' ', args)}: stopped after 20 minutes");
                return -1;
            }
            log.AppendLine($"$ {file} {string.Join(' ', args)}").Append(stdout.Result).Append(stderr.Result);
            return p.ExitCode;
        }
        catch (System.ComponentModel.Win32Exception e)
        {
            log.AppendLine($"{file}: could not be started ({e.Message})");
            return -1;
        }
    }

    /// <summary>Writes a screenshot of <paramref name="page"/> (a file path) with chromium's own --screenshot switch.</summary>
    public static void Screenshot(string page, string png, string profile, int width = 1280, int height = 2400)
    {
        var info = Start(profile, [$"--screenshot={png}", $"--window-size={width},{height}", new Uri(page).AbsoluteUri]);
        using var p = Process.Start(info)!;
        p.BeginErrorReadLine();
        p.BeginOutputReadLine();
        if (!p.WaitForExit(TimeSpan.FromMinutes(2)))
        {
            p.Kill(entireProcessTree: true);
            throw new TimeoutException("chromium --screenshot did not finish within 2 minutes.");
        }
    }

    private static ProcessStartInfo Start(string profile, IEnumerable<string> args)
    {
        var info = new ProcessStartInfo(Executable) { RedirectStandardError = true, RedirectStandardOutput = true, UseShellExecute = false };
        foreach (var s in Switches) info.ArgumentList.Add(s);
        info.ArgumentList.Add($"--user-data-dir={profile}");
        foreach (var a in args) info.ArgumentList.Add(a);
        return info;
    }

    /// <summary>What a page did when it loaded.</summary>
    /// <param name="Images">Per image in document order: its id, alt text, naturalWidth and whether it decoded.</param>
    /// <param name="ConsoleErrors">Console errors, uncaught exceptions and browser log errors.</param>
    /// <param name="Requests">Requests for anything other than the page itself and data URIs.</param>
    public sealed record PageReport(IReadOnlyList<(string Id, string Alt, int NaturalWidth, bool Decoded)> Images,
        IReadOnlyList<string> ConsoleErrors, IReadOnlyList<string> Requests);

    /// <summary>Opens <paramref name="page"/> in a fresh headless chromium, waits for it to load and reports what it saw.</summary>
    public static async Task<PageReport> Open(string page, string profile)
    {
        var info = Start(profile, ["--remote-debugging-port=0", "--window-size=1280,900", "about:blank"]);
        using var process = Process.Start(info)!;
        var listening = new TaskCompletionSource<string>(TaskCreationOptions.RunContinuationsAsynchronously);
        var stderr = new StringBuilder();
        process.ErrorDataReceived += (_, e) =>
        {
            if (e.Data is null) { listening.TrySetException(new InvalidOperationException($"chromium ended before listening:\n{stderr}")); return; }
            lock (stderr) stderr.AppendLine(e.Data);
            const string marker = "DevTools listening on ";
            int at = e.Data.IndexOf(marker, StringComparison.Ordinal);
            if (at >= 0) listening.TrySetResult(e.Data[(at + marker.Length)..].Trim());
        };
        process.BeginErrorReadLine();
        process.BeginOutputReadLine();
        try
        {
            string browserUrl = await listening.Task.WaitAsync(TimeSpan.FromSeconds(60));
            var port = new Uri(browserUrl).Port;
            using var http = new HttpClient(new HttpClientHandler { UseProxy = false }) { Timeout = TimeSpan.FromSeconds(30) };
            var targets = JsonNode.Parse(await http.GetStringAsync($"http://127.0.0.1:{port}/json/list"))!.AsArray();
            string pageUrl = targets.First(t => (string?)t!["type"] == "page")!["webSocketDebuggerUrl"]!.GetValue<string>();
            await using var session = await DevToolsSession.Connect(new Uri(pageUrl));
            foreach (var domain in new[] { "Runtime", "Log", "Network", "Page" }) await session.Call($"{domain}.enable");
            var loaded = session.WaitFor("Page.loadEventFired");
            await session.Call("Page.navigate", new JsonObject { ["url"] = new Uri(page).AbsoluteUri });
            await loaded.WaitAsync(TimeSpan.FromSeconds(120));
            const string script = """
                (async () => {
                  const images = Array.from(document.images);
                  const decoded = await Promise.all(images.map(i => i.decode().then(() => true, () => false)));
                  return JSON.stringify(images.map((i, k) => ({ id: i.id, alt: i.alt, width: i.naturalWidth, decoded: decoded[k] })));
                })()
                """;
            var result = await session.Call("Runtime.evaluate", new JsonObject { ["expression"] = script, ["awaitPromise"] = true, ["returnByValue"] = true });
            var images = JsonNode.Parse(result["result"]!["value"]!.GetValue<string>())!.AsArray()
                .Select(i => ((string)i!["id"]!, (string)i["alt"]!, (int)i["width"]!, (bool)i["decoded"]!)).ToArray();
            await Task.Delay(200); // let late console messages arrive
            return new PageReport(images, session.Errors(), session.Requests(new Uri(page).AbsoluteUri));
        }
        finally
        {
            if (!process.HasExited) process.Kill(entireProcessTree: true);
            process.WaitForExit(10_000);
        }
    }

    /// <summary>One DevTools WebSocket: calls with ids, events collected as they come.</summary>
    private sealed class DevToolsSession : IAsyncDisposable
    {
        private readonly ClientWebSocket _socket = new();
        private readonly Dictionary<int, TaskCompletionSource<JsonObject>> _pending = [];
        private readonly List<JsonObject> _events = [];
        private readonly List<(string Method, TaskCompletionSource Done)> _waits = [];
        private readonly CancellationTokenSource _stop = new();
        private Task? _reader;
        private int _next;

        public static async Task<DevToolsSession> Connect(Uri url)
        {
            var s = new DevToolsSession();
            s._socket.Options.Proxy = null;
            await s._socket.ConnectAsync(url, CancellationToken.None);
            s._reader = Task.Run(s.Read);
            return s;
        }

        public Task WaitFor(string method)
        {
            var done = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);
            lock (_events)
            {
                if (_events.Any(e => (string?)e["method"] == method)) done.TrySetResult();
                else _waits.Add((method, done));
            }
            return done.Task;
        }

        public async Task<JsonObject> Call(string method, JsonObject? parameters = null)
        {
            var done = new TaskCompletionSource<JsonObject>(TaskCreationOptions.RunContinuationsAsynchronously);
            int id;
            lock (_pending) { id = ++_next; _pending[id] = done; }
            var message = new JsonObject { ["id"] = id, ["method"] = method, ["params"] = parameters ?? new JsonObject() };
            await _socket.SendAsync(Encoding.UTF8.GetBytes(message.ToJsonString()), WebSocketMessageType.Text, true, CancellationToken.None);
            var reply = await done.Task.WaitAsync(TimeSpan.FromSeconds(60));
            if (reply["error"] is { } error) throw new InvalidOperationException($"{method}: {error.ToJsonString()}");
            return reply["result"]?.AsObject() ?? new JsonObject();
        }

        public IReadOnlyList<string> Errors()
        {
            lock (_events)
                return _events.Select(e => ((string?)e["method"], e["params"])).Select(e => e.Item1 switch
                {
                    "Runtime.consoleAPICalled" when (string?)e.Item2!["type"] is "error" or "assert" => "console: " + e.Item2!["args"]!.ToJsonString(),
                    "Runtime.exceptionThrown" => "exception: " + e.Item2!["exceptionDetails"]!.ToJsonString(),
                    "Log.entryAdded" when (string?)e.Item2!["entry"]!["level"] == "error" => "log: " + e.Item2!["entry"]!.ToJsonString(),
                    _ => null,
                }).OfType<string>().ToArray();
        }

        public IReadOnlyList<string> Requests(string page)
        {
            lock (_events)
                return _events.Where(e => (string?)e["method"] == "Network.requestWillBeSent")
                    .Select(e => (string)e["params"]!["request"]!["url"]!)
                    .Where(u => u != page && !u.StartsWith("data:", StringComparison.Ordinal) && u != "about:blank").ToArray();
        }

        private async Task Read()
        {
            var buffer = new byte[1 << 16];
            var message = new MemoryStream();
            try
            {
                while (!_stop.IsCancellationRequested && _socket.State == WebSocketState.Open)
                {
                    var r = await _socket.ReceiveAsync(buffer, _stop.Token);
                    if (r.MessageType == WebSocketMessageType.Close) break;
                    message.Write(buffer, 0, r.Count);
                    if (!r.EndOfMessage) continue;
                    var json = JsonNode.Parse(message.ToArray())!.AsObject();
                    message.SetLength(0);
                    if (json["id"] is { } idNode)
                    {
                        TaskCompletionSource<JsonObject>? done;
                        lock (_pending) _pending.Remove(idNode.GetValue<int>(), out done);
                        done?.TrySetResult(json);
                    }
                    else
                    {
                        lock (_events)
                        {
                            _events.Add(json);
                            string? method = (string?)json["method"];
                            foreach (var w in _waits.Where(w => w.Method == method).ToArray()) { w.Done.TrySetResult(); _waits.Remove(w); }
                        }
                    }
                }
            }
            catch (OperationCanceledException) { }
            catch (WebSocketException) { }
        }

        public async ValueTask DisposeAsync()
        {
            await _stop.CancelAsync();
            try { await _socket.CloseOutputAsync(WebSocketCloseStatus.NormalClosure, "done", CancellationToken.None); } catch (WebSocketException) { }
            if (_reader is not null) await Task.WhenAny(_reader, Task.Delay(2000));
            _socket.Dispose();
            _stop.Dispose();
        }
    }
}
