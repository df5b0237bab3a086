using Bunit;
using RunWatch.Web.Components.Shared;
using RunWatch.Web.Tests.Support;
using Xunit;

namespace RunWatch.Web.Tests.Components.Shared;

/// <summary>The "what is this" notes: every glossary term renders closed with its name and text, an unknown term fails loudly.</summary>
public sealed class ExplainTests
{
    public static TheoryData<string> Terms => [.. Glossary.Terms.Keys];

    [Theory]
    [MemberData(nameof(Terms))]
    public void Render_Term_NameAndTextInsideClosedDetails(string term)
    {
        using var ctx = new DashboardTestContext(seed: false);
        var note = ctx.Render<Explain>(p => p.Add(x => x.Term, term));
        var details = note.Find("details.explain");
        Assert.False(details.HasAttribute("open"));
        Assert.Equal("?", note.Find("summary").TextContent);
        Assert.Contains(Glossary.Terms[term].Name, note.Find(".explain-text").TextContent, StringComparison.Ordinal);
        Assert.True(Glossary.Terms[term].Text.Length > 40);
    }

    [Fact]
    public void Render_UnknownTerm_Throws()
    {
        using var ctx = new DashboardTestContext(seed: false);
        Assert.Throws<KeyNotFoundException>(() => ctx.Render<Explain>(p => p.Add(x => x.Term, "no-such-term")));
    }

    [Fact]
    public void Glossary_CoversTheFiguresNewcomersMeet()
    {
        string[] needed = ["lambda", "lambda-eff", "a-hat", "t-eff", "clark-evans", "verdict", "control-limits", "uniformity", "run-rules", "baseline"];
        Assert.All(needed, t => Assert.True(Glossary.Terms.ContainsKey(t), t));
    }
}
