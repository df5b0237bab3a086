using System.Globalization;
using System.Text.Json;
using System.Text.RegularExpressions;
using Microsoft.Playwright;
using RunWatch.Simulation.Demo;
using RunWatch.Tests.Demo;
using Xunit;
using Xunit.Abstractions;

namespace RunWatch.Tests.Dashboard;

/// <summary>
/// Over the real <c>runwatch demo</c> in headless Chromium: an SEM field uploaded in the browser is analysed (its
/// queue state moves to DONE) and appears on its wafer; a file that is not an image is refused with a clear message
/// and stores nothing; the full-field viewer pans, zooms and toggles its overlays, and a wire clicked in the field
/// rings its point in the chart while a point clicked in the chart selects its wire; notes on a run and a wafer are
/// added and shown newest first as text; each screen is captured and checked for the error bar, "NaN" and console errors.
/// </summary>
[Collection(DemoCollection.Name)]
public sealed partial class DemoFieldScreensBrowserTests(DemoFixture demo, ITestOutputHelper output)
{
    private const string Wafer = "W-DEMO-01-A";
    private static readonly LocatorAssertionsToBeVisibleOptions Soon = new() { Timeout = 20_000 };
    private static readonly LocatorAssertionsToContainTextOptions SoonText = new() { Timeout = 20_000 };

    [Fact]
    public async Task Upload_FieldInBrowser_RefusesBadFileThenAnalysesAndShowsOnWafer()
    {
        await demo.WaitAllReportedAsync();
        string folder = Directory.CreateTempSubdirectory("rw-upload-").FullName;
        // A new invented field of the demo wafer (own seed, so new bytes), with the sidecar the generator writes beside it.
        string generated = DemoWaferFields.Write(folder, Wafer, 300, 1e9, 1, 4242)[0];
        string image = Path.Combine(folder, Wafer + "_browser01.png");
        File.Move(generated, image);
        File.Move(generated + ".field.json", Path.Combine(folder, "browser01.field.json"));
        string notImage = Path.Combine(folder, Wafer + "_notes.png");
        await File.WriteAllTextAsync(notImage, "this is a text file with a .png name");

        var page = await demo.LoginAsync("engineer");
        var errors = ConsoleErrors(page);
        await page.GotoAsync(demo.BaseUrl + "/fields");
        await Assertions.Expect(page.Locator("[data-testid=queue]")).ToBeVisibleAsync(Soon);
        int rowsBefore = await page.Locator("[data-testid=queue-row]").CountAsync();

        // A bad file: refused at once, with the decoder's reason, and nothing stored.
        await page.Locator("[data-testid=upload-image]").SetInputFilesAsync(notImage);
        await page.Locator("[data-testid=upload]").ClickAsync();
        var message = page.Locator("[data-testid=upload-message]");
        await Assertions.Expect(message).ToContainTextAsync("Refused: not an image the analysis can read", new() { Timeout = 20_000 });
        await Assertions.Expect(message).ToContainTextAsync("Nothing was stored.");
        output.WriteLine("bad file: " + await message.InnerTextAsync());
        Assert.Equal(rowsBefore, await page.Locator("[data-testid=queue-row]").CountAsync());
        string dropFolder = DropFolderLine().Match(demo.Output).Groups[1].Value.Trim();
        Assert.True(Directory.Exists(dropFolder), "the demo names its drop folder: " + dropFolder);
        Assert.False(File.Exists(Path.Combine(dropFolder, "uploads", Path.GetFileName(notImage))), "a refused upload leaves no file");
        Assert.Empty(Directory.Exists(Path.Combine(dropFolder, "uploads")) ? Directory.GetFiles(Path.Combine(dropFolder, "uploads"), ".*") : []); // no partial files

        // The real field with its sidecar file: stored, queued, analysed.
        await page.Locator("[data-testid=upload-image]").SetInputFilesAsync(image);
        await page.Locator("[data-testid=upload-sidecar]").SetInputFilesAsync(Path.Combine(folder, "browser01.field.json"));
        await page.Locator("[data-testid=upload]").ClickAsync();
        await Assertions.Expect(message).ToContainTextAsync("queued for analysis", new() { Timeout = 30_000 });
        string text = await message.InnerTextAsync();
        string fieldId = FieldIdInMessage().Match(text).Groups[1].Value;
        output.WriteLine("upload: " + text);
        var row = page.Locator($"[data-testid=queue-row][data-field='{fieldId}']");
        await Assertions.Expect(row).ToBeVisibleAsync(Soon);
        var states = new List<string>();
        var deadline = DateTime.UtcNow.AddMinutes(3);
        while (DateTime.UtcNow < deadline)
        {
            string state = await row.GetAttributeAsync("data-state") ?? "";
            if (states.Count == 0 || states[^1] != state)
            {
                states.Add(state);
            }
            if (state is "Done" or "Failed" or "Refused")
            {
                break;
            }
            await Task.Delay(200);
        }
        output.WriteLine("queue states seen: " + string.Join(" → ", states));
        Assert.Equal("Done", states[^1]);
        await Assertions.Expect(row).ToContainTextAsync("DONE");
        await Assertions.Expect(row).ToContainTextAsync(Wafer);
        await CheckScreenAsync(page, "fields-upload-queue");

        // On the wafer page once its report has been written again with the new field.
        await page.GotoAsync(demo.BaseUrl + "/wafers/" + Wafer);
        var figure = page.Locator("figure.field", new() { HasText = "browser01" });
        await Assertions.Expect(figure).ToBeVisibleAsync(new() { Timeout = 60_000 });
        await Assertions.Expect(figure.Locator("figcaption")).ToContainTextAsync(new Regex(@"[1-9]\d* wires"));
        Assert.Equal("fields/" + fieldId, await figure.Locator("[data-testid=open-field]").GetAttributeAsync("href"));
        Assert.Empty(errors);

        // A viewer cannot upload: the form is disabled and the API refuses.
        var viewer = await demo.LoginAsync("viewer");
        await viewer.GotoAsync(demo.BaseUrl + "/fields");
        await Assertions.Expect(viewer.Locator("[data-testid=upload-read-only]")).ToBeVisibleAsync(Soon);
        await Assertions.Expect(viewer.Locator("[data-testid=upload]")).ToBeDisabledAsync();
        var refused = await viewer.APIRequest.PostAsync(demo.BaseUrl + "/api/fields/upload?name=" + Wafer + "_viewer.png",
            new() { DataByte = await File.ReadAllBytesAsync(image), Headers = new Dictionary<string, string> { ["Origin"] = demo.BaseUrl } });
        Assert.Equal(403, refused.Status);
        await viewer.CloseAsync();
        await page.CloseAsync();
        Directory.Delete(folder, recursive: true);
    }

    [Fact]
    public async Task FieldViewer_PanZoomOverlays_ChartAndWireLinkBothWays()
    {
        await demo.WaitAllReportedAsync();
        var page = await demo.LoginAsync("engineer");
        var errors = ConsoleErrors(page);
        await page.GotoAsync(demo.BaseUrl + "/wafers/" + Wafer);
        var open = page.Locator("[data-testid=open-field]").First;
        await Assertions.Expect(open).ToBeVisibleAsync(Soon);
        string fieldPath = "/" + (await open.GetAttributeAsync("href"))!;
        string fieldId = fieldPath[(fieldPath.LastIndexOf('/') + 1)..];
        await page.GotoAsync(demo.BaseUrl + fieldPath);

        var svg = page.Locator("[data-testid=field-svg]");
        await Assertions.Expect(svg).ToBeVisibleAsync(Soon);
        await Assertions.Expect(page.Locator("#linked-parity-chart .main-svg").First).ToBeVisibleAsync(Soon);
        int wires = await page.Locator("[data-testid=wire]").CountAsync();
        Assert.True(wires > 20, $"{wires} wires drawn");
        var full = await page.APIRequest.GetAsync(demo.BaseUrl + $"/api/fields/{fieldId}/full?layer=plain");
        Assert.Equal(200, full.Status);
        Assert.StartsWith("image/", full.Headers["content-type"], StringComparison.Ordinal);
        await page.WaitForFunctionAsync("() => document.querySelector('[data-testid=field-svg]').dataset.zoom === '1.000'", null, new() { Timeout = 20_000 });

        // Field → chart: a compared wire clicked in the field rings its point and shows its figures.
        var wire = page.Locator("[data-testid=wire][data-compared=true]").Nth(3);
        string wireId = (await wire.GetAttributeAsync("data-wire"))!;
        await wire.DispatchEventAsync("click");
        await Assertions.Expect(page.Locator("[data-testid=wire-figures]")).ToHaveAttributeAsync("data-wire", wireId, new() { Timeout = 10_000 });
        await Assertions.Expect(page.Locator("[data-testid=linked-parity]")).ToHaveAttributeAsync("data-selected", fieldId + "/" + wireId);
        await Assertions.Expect(page.Locator("[data-testid=selected-wire]")).ToHaveAttributeAsync("data-wire", wireId);
        double[] ringed = await WaitSelectedPointAsync(page);
        Assert.InRange(NumberOf(await page.Locator("[data-testid=wire-predicted]").InnerTextAsync()) - ringed[0], -0.051, 0.051); // shown to 0.1 nm
        Assert.InRange(NumberOf(await page.Locator("[data-testid=wire-measured]").InnerTextAsync()) - ringed[1], -0.051, 0.051);
        output.WriteLine($"field → chart: wire {wireId} ringed at predicted {ringed[0]:F2} nm, measured {ringed[1]:F2} nm");

        // Chart → field: a real mouse click on another point of this field selects the wire it stands for.
        var point = await page.EvaluateAsync<double[]>("""
            () => {
              const gd = document.getElementById('linked-parity-chart');
              const xa = gd._fullLayout.xaxis, ya = gd._fullLayout.yaxis, r = gd.getBoundingClientRect();
              const px = (x, y) => [r.left + xa._offset + xa.l2p(x), r.top + ya._offset + ya.l2p(y)];
              const all = [0, 1].flatMap(c => gd.data[c].x.map((x, i) => px(x, gd.data[c].y[i])));
              // The point of this field farthest (on screen) from any other point, so that the click is unambiguous.
              const t = gd.data[1]; let best = 0, bestGap = -1;
              const sel = gd.data[2];
              t.x.forEach((x, k) => {
                if (sel.x.length === 1 && sel.x[0] === x && sel.y[0] === t.y[k]) return; // not the wire selected already
                const [a, b] = px(x, t.y[k]);
                const gap = Math.min(...all.map(([c, d]) => (c === a && d === b) ? Infinity : Math.hypot(c - a, d - b)));
                if (gap > bestGap) { bestGap = gap; best = k; }
              });
              const [cx, cy] = px(t.x[best], t.y[best]);
              return [cx, cy, t.x[best], t.y[best], bestGap];
            }
            """);
        await page.Mouse.ClickAsync((float)point[0], (float)point[1]);
        await page.WaitForFunctionAsync($"() => document.querySelector('[data-testid=wire-figures]').dataset.wire !== '{wireId}'", null, new() { Timeout = 10_000 });
        string chosen = (await page.Locator("[data-testid=wire-figures]").GetAttributeAsync("data-wire"))!;
        Assert.InRange(NumberOf(await page.Locator("[data-testid=wire-predicted]").InnerTextAsync()) - point[2], -0.051, 0.051); // shown to 0.1 nm
        Assert.InRange(NumberOf(await page.Locator("[data-testid=wire-measured]").InnerTextAsync()) - point[3], -0.051, 0.051);
        await Assertions.Expect(page.Locator("[data-testid=selected-wire]")).ToHaveAttributeAsync("data-wire", chosen);
        output.WriteLine($"chart → field: point ({point[2]:F2}, {point[3]:F2}) nm, {point[4]:F1} px from its nearest neighbour, selected wire {chosen}");

        // Pan and zoom: wheel about the pointer, the buttons, a drag; "Whole field" goes back.
        var frame = page.Locator("[data-testid=viewer-frame]");
        await page.Locator("[data-testid=zoom-fit]").ClickAsync();
        await Assertions.Expect(svg).ToHaveAttributeAsync("data-zoom", "1.000");
        var box = (await frame.BoundingBoxAsync())!;
        await page.Mouse.MoveAsync(box.X + box.Width / 2, box.Y + box.Height / 2);
        await page.Mouse.WheelAsync(0, -300);
        await page.WaitForFunctionAsync("() => Number(document.querySelector('[data-testid=field-svg]').dataset.zoom) > 1.2");
        double afterWheel = double.Parse((await svg.GetAttributeAsync("data-zoom"))!, CultureInfo.InvariantCulture);
        await page.Locator("[data-testid=zoom-in]").ClickAsync();
        await page.WaitForFunctionAsync($"() => Number(document.querySelector('[data-testid=field-svg]').dataset.zoom) > {afterWheel.ToString(CultureInfo.InvariantCulture)} * 1.4");
        string before = (await svg.GetAttributeAsync("viewBox"))!;
        await page.Mouse.MoveAsync(box.X + 200, box.Y + 200);
        await page.Mouse.DownAsync();
        await page.Mouse.MoveAsync(box.X + 300, box.Y + 260, new() { Steps = 5 });
        await page.Mouse.UpAsync();
        string after = (await svg.GetAttributeAsync("viewBox"))!;
        Assert.NotEqual(before, after);
        Assert.True(ViewBox(after)[0] < ViewBox(before)[0], $"dragging right moves the view left: {before} → {after}");
        await Assertions.Expect(page.Locator("[data-testid=wire-figures]")).ToHaveAttributeAsync("data-wire", chosen); // a drag selects nothing
        output.WriteLine($"zoom after wheel {afterWheel:F2}, viewBox {before} → {after} by drag");

        // Overlays on and off.
        await page.Locator("[data-testid=show-zones]").CheckAsync();
        await page.Locator("[data-testid=show-labels]").CheckAsync();
        await Assertions.Expect(page.Locator("[data-testid=zones] polygon").First).ToBeAttachedAsync();
        await Assertions.Expect(page.Locator("[data-testid=labels] text")).ToHaveCountAsync(wires);
        await page.Locator("[data-testid=show-outlines]").UncheckAsync();
        await Assertions.Expect(page.Locator("circle.wire-outline[data-testid=wire]")).ToHaveCountAsync(0);
        await Assertions.Expect(page.Locator("circle.wire-hit[data-testid=wire]")).ToHaveCountAsync(wires); // still clickable
        await page.Locator("[data-testid=show-outlines]").CheckAsync();
        await page.Locator("[data-testid=zoom-fit]").ClickAsync();
        await page.Locator("[data-testid=show-labels]").UncheckAsync();
        await CheckScreenAsync(page, "field-viewer");

        // Re-analysis with a reason: queued, then done again.
        await page.Locator("[data-testid=reanalyse-reason]").FillAsync("browser test: threshold check");
        await page.Locator("[data-testid=reanalyse-button]").ClickAsync();
        await Assertions.Expect(page.Locator("[data-testid=reanalyse-message]")).ToContainTextAsync("queued for analysis again by", SoonText);
        await page.GotoAsync(demo.BaseUrl + "/fields");
        await Assertions.Expect(page.Locator($"[data-testid=queue-row][data-field='{fieldId}']")).ToHaveAttributeAsync("data-state", "Done", new() { Timeout = 120_000 });
        Assert.Empty(errors);
        await page.CloseAsync();
    }

    [Fact]
    public async Task Notes_OnRunAndWafer_AddedNewestFirstAsTextAndAudited()
    {
        await demo.WaitAllReportedAsync();
        var page = await demo.LoginAsync("engineer");
        var errors = ConsoleErrors(page);
        await page.GotoAsync(demo.BaseUrl + "/runs");
        var runLink = page.Locator("[data-testid=run-row] a[href*='runs/']").First;
        await Assertions.Expect(runLink).ToBeVisibleAsync(Soon);
        string runPath = "/" + (await runLink.GetAttributeAsync("href"))!.TrimStart('/');
        string stamp = DateTime.UtcNow.ToString("HHmmssfff", CultureInfo.InvariantCulture);
        foreach (var (path, name) in new[] { (runPath, "run-notes"), ("/wafers/" + Wafer, "wafer-notes") })
        {
            await page.GotoAsync(demo.BaseUrl + path);
            var text = page.Locator("[data-testid=note-text]");
            await Assertions.Expect(text).ToBeVisibleAsync(Soon);
            string first = $"<b>not bold</b> {stamp} first: growth paused 20 s";
            string second = $"{stamp} second:\nline two";
            await text.FillAsync(first);
            await page.Locator("[data-testid=note-add]").ClickAsync();
            await Assertions.Expect(page.Locator("[data-testid=note]").First).ToContainTextAsync(first, SoonText);
            await text.FillAsync(second);
            await page.Locator("[data-testid=note-add]").ClickAsync();
            await Assertions.Expect(page.Locator("[data-testid=note]").First).ToContainTextAsync("line two", SoonText);
            await Assertions.Expect(page.Locator("[data-testid=note]").Nth(1)).ToContainTextAsync(first);
            Assert.Equal(0, await page.Locator("[data-testid=note] b").CountAsync()); // shown as text, never as markup
            await Assertions.Expect(page.Locator("[data-testid=note]").First).ToContainTextAsync(Users(demo, "engineer"));
            await CheckScreenAsync(page, name);
        }
        Assert.Empty(errors);
        await page.CloseAsync();

        var admin = await demo.LoginAsync("admin");
        using var audit = JsonDocument.Parse(await (await admin.APIRequest.GetAsync(demo.BaseUrl + "/api/audit")).TextAsync());
        var added = audit.RootElement.EnumerateArray().Where(a => a.GetProperty("action").GetString() == "note added"
            && a.GetProperty("detail").GetString()!.Contains(stamp, StringComparison.Ordinal)).ToList();
        Assert.Equal(4, added.Count);
        Assert.All(added, a => Assert.Equal(Users(demo, "engineer"), a.GetProperty("user").GetString()));

        await admin.CloseAsync();
        var viewer = await demo.LoginAsync("viewer");
        await viewer.GotoAsync(demo.BaseUrl + "/wafers/" + Wafer);
        await Assertions.Expect(viewer.Locator("[data-testid=notes-read-only]")).ToBeVisibleAsync(Soon);
        Assert.Equal(0, await viewer.Locator("[data-testid=note-text]").CountAsync());
        await Assertions.Expect(viewer.Locator("[data-testid=note]").First).ToContainTextAsync(stamp);
        await viewer.CloseAsync();
    }

    private static string Users(DemoFixture demo, string role) => demo.Users[role].Name;

    private static List<string> ConsoleErrors(IPage page)
    {
        var errors = new List<string>();
        page.Console += (_, m) =>
        {
            if (m.Type == "error" && !m.Location.Contains("favicon", StringComparison.Ordinal))
            {
                errors.Add(m.Text);
            }
        };
        return errors;
    }

    /// <summary>As the every-screen test: no error bar, no "exception", no "NaN"; then a full-page capture.</summary>
    private async Task CheckScreenAsync(IPage page, string name)
    {
        await Assertions.Expect(page.Locator("[data-testid=standing-caution]")).ToBeVisibleAsync();
        await page.WaitForLoadStateAsync(LoadState.NetworkIdle);
        await Assertions.Expect(page.Locator("#blazor-error-ui")).ToBeHiddenAsync();
        string body = (await page.Locator("main").InnerTextAsync()).ToUpperInvariant();
        Assert.DoesNotContain("EXCEPTION", body, StringComparison.Ordinal);
        Assert.DoesNotContain("NAN", Regex.Replace(body, "[A-Z]NAN|NAN[A-Z]", ""), StringComparison.Ordinal);
        output.WriteLine($"{name,-20} {await demo.ScreenshotAsync(page, name)}");
    }

    private static async Task<double[]> WaitSelectedPointAsync(IPage page)
    {
        await page.WaitForFunctionAsync("() => { const gd = document.getElementById('linked-parity-chart'); return gd && gd.data && gd.data[2].x.length === 1; }",
            null, new() { Timeout = 10_000 });
        return await page.EvaluateAsync<double[]>("() => { const t = document.getElementById('linked-parity-chart').data[2]; return [t.x[0], t.y[0]]; }");
    }

    private static double NumberOf(string text) =>
        double.Parse(NumberText().Match(text.Replace('−', '-')).Value, CultureInfo.InvariantCulture);

    private static double[] ViewBox(string viewBox) =>
        [.. viewBox.Split(' ', StringSplitOptions.RemoveEmptyEntries).Select(v => double.Parse(v, CultureInfo.InvariantCulture))];

    [GeneratedRegex(@"SEM fields \(invented\) dropped into ([^;\r\n]+)", RegexOptions.Multiline)]
    private static partial Regex DropFolderLine();

    [GeneratedRegex(@"as field (\d+)")]
    private static partial Regex FieldIdInMessage();

    [GeneratedRegex(@"-?\d+(\.\d+)?")]
    private static partial Regex NumberText();
}
