using Bunit;
using Microsoft.AspNetCore.Components.Forms;
using Microsoft.Extensions.DependencyInjection;
using RunWatch.Web.Components.Fields;
using RunWatch.Web.Components.Pages;
using RunWatch.Web.Data.Fields;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Components.Fields;

public sealed class FieldsPageTests
{
    private static readonly DateTimeOffset T0 = DashboardTestContext.Now;

    [Fact]
    public void Render_Queue_EveryStateWithWordShapeAndReason()
    {
        using var ctx = new DashboardTestContext();
        var pipeline = new FakeFieldPipeline();
        pipeline.Fields.AddRange(
        [
            new FieldQueueEntry("5", "uploads/W-2030-A_f5.png", "W-2030-A", FieldQueueState.Running, null, T0, null),
            new FieldQueueEntry("4", "W-2030-A_f4.tif", "W-2030-A", FieldQueueState.Failed, "not a TIFF, PNG, JPEG or BMP image", T0.AddMinutes(-1), null),
            new FieldQueueEntry("3", ".hidden.png", null, FieldQueueState.Refused, "refused: hidden file", T0.AddMinutes(-2), null),
            new FieldQueueEntry("2", "f2.png", null, FieldQueueState.WaitingForWafer, "no wafer id in the file name or sidecar", T0.AddMinutes(-3), null),
            new FieldQueueEntry("1", "W-2030-A_f1.png", "W-2030-A", FieldQueueState.Done, null, T0.AddMinutes(-4), 212),
        ]);
        ctx.Services.AddSingleton<IFieldPipeline>(pipeline);
        var page = ctx.Render<RunWatch.Web.Components.Pages.Fields>();

        var rows = page.FindAll("[data-testid=queue-row]");
        Assert.Equal(["RUNNING", "FAILED", "REFUSED", "WAITING FOR WAFER", "DONE"], rows.Select(r => r.QuerySelector(".state")!.TextContent.Trim()[2..]));
        Assert.Equal("■", rows[1].QuerySelector(".glyph")!.TextContent.Trim());
        Assert.Contains("refused: hidden file", rows[2].TextContent, StringComparison.Ordinal);
        Assert.Equal("fields/1", rows[4].QuerySelector("[data-testid=open-field]")!.GetAttribute("href"));
        Assert.Contains("212", rows[4].TextContent, StringComparison.Ordinal);
        Assert.Contains("0 queued · 1 running · 1 done · 1 failed · 1 refused · 1 waiting for a wafer", page.Find("[data-testid=queue-summary]").TextContent, StringComparison.Ordinal);
    }

    [Fact]
    public void Upload_ImageWithFormFields_PassedWithUserAndMessageShown()
    {
        using var ctx = new DashboardTestContext();
        var pipeline = new FakeFieldPipeline();
        ctx.Services.AddSingleton<IFieldPipeline>(pipeline);
        var page = ctx.Render<RunWatch.Web.Components.Pages.Fields>();

        page.FindComponents<InputFile>()[0].UploadFiles(InputFileContent.CreateFromBinary([1, 2, 3, 4], "W-2030-A_f9.tif"));
        page.Find("[data-testid=upload-wafer]").Change("W-2030-A");
        page.Find("[data-testid=upload-pixel]").Change("2.5");
        page.Find("[data-testid=upload-x]").Change("12.5");
        page.Find("[data-testid=upload-y]").Change("-3");
        page.Find("[data-testid=upload]").Click();

        var (request, bytes, user) = Assert.Single(pipeline.Uploads);
        Assert.Equal(new FieldUploadRequest("W-2030-A_f9.tif", "W-2030-A", 2.5, 12.5, -3), request);
        Assert.Equal(new byte[] { 1, 2, 3, 4 }, bytes);
        Assert.Equal("test-engineer", user);
        Assert.Equal("notice", page.Find("[data-testid=upload-message]").ClassName);
    }

    [Fact]
    public void Upload_Refused_MessageSaysWhyAsRefusal()
    {
        using var ctx = new DashboardTestContext();
        var pipeline = new FakeFieldPipeline { NextResult = FieldUploadResult.Refused("Refused: not an image the analysis can read. Nothing was stored.") };
        ctx.Services.AddSingleton<IFieldPipeline>(pipeline);
        var page = ctx.Render<RunWatch.Web.Components.Pages.Fields>();
        page.FindComponents<InputFile>()[0].UploadFiles(InputFileContent.CreateFromText("hello", "W-2030-A_f9.png"));
        page.Find("[data-testid=upload]").Click();
        Assert.Equal("refusal", page.Find("[data-testid=upload-message]").ClassName);
        Assert.Contains("Nothing was stored", page.Find("[data-testid=upload-message]").TextContent, StringComparison.Ordinal);
    }

    [Fact]
    public void Upload_TooLargeOrNoImage_RefusedBeforeAnythingIsSent()
    {
        using var ctx = new DashboardTestContext();
        var pipeline = new FakeFieldPipeline { MaxUploadBytes = 3 };
        ctx.Services.AddSingleton<IFieldPipeline>(pipeline);
        var page = ctx.Render<RunWatch.Web.Components.Pages.Fields>();
        page.Find("[data-testid=upload]").Click();
        string none = page.Find("[data-testid=upload-message]").TextContent;
        page.FindComponents<InputFile>()[0].UploadFiles(InputFileContent.CreateFromBinary([1, 2, 3, 4], "big.png"));
        page.Find("[data-testid=upload]").Click();

        Assert.Equal("Choose an image first.", none);
        Assert.Contains("more than the limit of 3", page.Find("[data-testid=upload-message]").TextContent, StringComparison.Ordinal);
        Assert.Empty(pipeline.Uploads);
    }

    [Fact]
    public void Render_Viewer_FormDisabledAndSaysReadOnly()
    {
        using var ctx = new DashboardTestContext(role: "viewer");
        var pipeline = new FakeFieldPipeline();
        ctx.Services.AddSingleton<IFieldPipeline>(pipeline);
        var page = ctx.Render<RunWatch.Web.Components.Pages.Fields>();
        Assert.NotNull(page.Find("[data-testid=upload-read-only]"));
        Assert.True(page.Find("[data-testid=upload]").HasAttribute("disabled"));
        Assert.True(page.Find("[data-testid=upload-wafer]").HasAttribute("disabled"));
    }

    [Fact]
    public void Render_NoPipeline_SaysNotAvailable()
    {
        using var ctx = new DashboardTestContext();
        Assert.NotNull(ctx.Render<RunWatch.Web.Components.Pages.Fields>().Find("[data-testid=pipeline-unavailable]"));
    }

    [Fact]
    public void Reanalyse_WithoutReasonRefused_WithReasonQueuedWithUser_ViewerDisabled()
    {
        using var ctx = new DashboardTestContext();
        var pipeline = new FakeFieldPipeline();
        ctx.Services.AddSingleton<IFieldPipeline>(pipeline);
        var panel = ctx.Render<ReanalysePanel>(p => p.Add(r => r.WaferId, "W-2030-A"));
        panel.Find("[data-testid=reanalyse-button]").Click();
        string refused = panel.Find("[data-testid=reanalyse-message]").TextContent;
        panel.Find("[data-testid=reanalyse-reason]").Change("threshold settings changed");
        panel.Find("[data-testid=reanalyse-button]").Click();
        var field = ctx.Render<ReanalysePanel>(p => p.Add(r => r.FieldId, "404"));
        field.Find("[data-testid=reanalyse-reason]").Change("check");
        field.Find("[data-testid=reanalyse-button]").Click();

        Assert.StartsWith("Not queued: Say why", refused, StringComparison.Ordinal);
        Assert.Equal(("wafer W-2030-A", "threshold settings changed", "test-engineer"), Assert.Single(pipeline.Reanalyses));
        Assert.Contains("3 field(s) of wafer W-2030-A queued for analysis again by test-engineer", panel.Find("[data-testid=reanalyse-message]").TextContent, StringComparison.Ordinal);
        Assert.Equal("Not queued: no field with id 404", field.Find("[data-testid=reanalyse-message]").TextContent);

        using var viewer = new DashboardTestContext(role: "viewer");
        viewer.Services.AddSingleton<IFieldPipeline>(pipeline);
        var read = viewer.Render<ReanalysePanel>(p => p.Add(r => r.WaferId, "W-2030-A"));
        Assert.True(read.Find("[data-testid=reanalyse-button]").HasAttribute("disabled"));
        Assert.NotNull(read.Find("[data-testid=reanalyse-read-only]"));
    }
}
