using RunWatch.Reports.Rendering;
using SkiaSharp;

namespace RunWatch.Reports.Pdf;

/// <summary>
/// A top-to-bottom flow layout on A4 pages of an SKDocument PDF: headings, wrapped paragraphs, tables and images,
/// with a running footer on every page. Text is drawn as text (not outlines), so PDF readers can extract it.
/// </summary>
internal sealed class PdfLayout : IDisposable
{
    public const float PageWidth = 595.28f;
    public const float PageHeight = 841.89f;
    public const float Margin = 42f;
    private const float FooterHeight = 30f;

    private readonly SKDocument _document;
    private readonly string _footerLeft;
    private readonly SKFont _body = new(ReportFonts.Regular, 8.8f);
    private readonly SKFont _bold = new(ReportFonts.Bold, 8.8f);
    private readonly SKFont _small = new(ReportFonts.Regular, 7f);
    private readonly SKPaint _ink = new() { Color = SKColors.Black, IsAntialias = true };
    private readonly SKPaint _grey = new() { Color = new SKColor(0x55, 0x55, 0x55), IsAntialias = true };
    private readonly SKPaint _rule = new() { Color = new SKColor(0xAA, 0xAA, 0xAA), StrokeWidth = 0.5f, IsStroke = true };
    private readonly SKPaint _shade = new() { Color = new SKColor(0xEE, 0xEE, 0xEE) };
    private SKCanvas? _canvas;
    private int _page;
    private float _y;

    public PdfLayout(SKDocument document, string footerLeft)
    {
        _document = document;
        _footerLeft = footerLeft;
        NewPage();
    }

    public float ContentWidth => PageWidth - (2 * Margin);

    private SKCanvas Canvas => _canvas ?? throw new InvalidOperationException("No open page.");

    private float Bottom => PageHeight - Margin - FooterHeight;

    public void Title(string text, string? subtitle)
    {
        using var font = new SKFont(ReportFonts.Bold, 17f);
        Ensure(30);
        Canvas.DrawText(text, Margin, _y + 17, SKTextAlign.Left, font, _ink);
        _y += 26;
        if (subtitle is { Length: > 0 })
        {
            Paragraph(subtitle, _grey);
        }
    }

    /// <summary>A section heading, kept on one page with the first <paramref name="keepWithNext"/> points of what follows.</summary>
    public void Heading(string text, SKColor? color = null, float keepWithNext = 40)
    {
        using var font = new SKFont(ReportFonts.Bold, 12f);
        using var paint = new SKPaint { Color = color ?? SKColors.Black, IsAntialias = true };
        Ensure(29 + keepWithNext);
        _y += 8;
        Canvas.DrawText(text, Margin, _y + 12, SKTextAlign.Left, font, paint);
        _y += 16;
        Canvas.DrawLine(Margin, _y, PageWidth - Margin, _y, _rule);
        _y += 5;
    }

    public void SubHeading(string text)
    {
        Ensure(40);
        _y += 3;
        Canvas.DrawText(text, Margin, _y + 9, SKTextAlign.Left, _bold, _ink);
        _y += 14;
    }

    public void Paragraph(string text, SKPaint? paint = null, SKFont? font = null)
    {
        font ??= _body;
        float lineHeight = font.Size * 1.35f;
        foreach (string line in Wrap(text, font, ContentWidth))
        {
            Ensure(lineHeight);
            Canvas.DrawText(line, Margin, _y + font.Size, SKTextAlign.Left, font, paint ?? _ink);
            _y += lineHeight;
        }
        _y += 3;
    }

    public void KeyValues(IReadOnlyList<(string Key, string Value)> rows)
    {
        float keyWidth = 150;
        float lineHeight = _body.Size * 1.4f;
        foreach ((string key, string value) in rows)
        {
            IReadOnlyList<string> lines = Wrap(value, _body, ContentWidth - keyWidth - 6);
            Ensure(lineHeight * lines.Count);
            Canvas.DrawText(key, Margin, _y + _body.Size, SKTextAlign.Left, _body, _grey);
            foreach (string line in lines)
            {
                Canvas.DrawText(line, Margin + keyWidth, _y + _body.Size, SKTextAlign.Left, _body, _ink);
                _y += lineHeight;
            }
        }
        _y += 4;
    }

    /// <summary>A table; <paramref name="widths"/> are fractions of the content width. Long cells wrap onto more lines (a row is as tall as its tallest cell); nothing is cut.</summary>
    public void Table(IReadOnlyList<string> headers, IReadOnlyList<string[]> rows, IReadOnlyList<float> widths, IReadOnlyList<SKColor?>? rowColours = null)
    {
        float rowHeight = _body.Size * 1.55f;
        void Header()
        {
            Ensure(RowHeight(headers, widths, _bold) + rowHeight);
            Canvas.DrawRect(Margin, _y, ContentWidth, rowHeight, _shade);
            DrawRow(headers, widths, _bold, _ink);
        }
        Header();
        for (int r = 0; r < rows.Count; r++)
        {
            if (_y + RowHeight(rows[r], widths, _body) > Bottom)
            {
                NewPage();
                Header();
            }
            using var paint = new SKPaint { Color = rowColours?[r] ?? SKColors.Black, IsAntialias = true };
            DrawRow(rows[r], widths, _body, paint);
        }
        _y += 6;
    }

    /// <summary>Draws a PNG scaled to <paramref name="width"/> points; returns false when the bytes do not decode.</summary>
    public bool Image(ReadOnlySpan<byte> png, float width, string? caption = null, float x = -1, bool advance = true)
    {
        using SKImage? image = SKImage.FromEncodedData(png);
        if (image is null)
        {
            return false;
        }
        float height = width * image.Height / image.Width;
        float captionHeight = caption is null ? 0 : _small.Size * 1.5f;
        if (x < 0)
        {
            Ensure(height + captionHeight + 4);
            x = Margin;
        }
        Canvas.DrawImage(image, SKRect.Create(x, _y, width, height), new SKSamplingOptions(SKFilterMode.Linear, SKMipmapMode.Linear));
        if (caption is not null)
        {
            Canvas.DrawText(Fit(caption, _small, width), x, _y + height + _small.Size + 1, SKTextAlign.Left, _small, _grey);
        }
        if (advance)
        {
            _y += height + captionHeight + 6;
        }
        return true;
    }

    /// <summary>Height an image of the given pixel size takes at <paramref name="width"/>, with its caption.</summary>
    public float ImageHeight(ReadOnlySpan<byte> png, float width, bool caption)
    {
        using SKImage? image = SKImage.FromEncodedData(png);
        return image is null ? 0 : (width * image.Height / image.Width) + (caption ? _small.Size * 1.5f : 0);
    }

    public void Ensure(float height)
    {
        if (_y + height > Bottom)
        {
            NewPage();
        }
    }

    public void Advance(float height) => _y += height;

    public void Dispose()
    {
        EndPage();
        _body.Dispose();
        _bold.Dispose();
        _small.Dispose();
        _ink.Dispose();
        _grey.Dispose();
        _rule.Dispose();
        _shade.Dispose();
    }

    private float RowHeight(IReadOnlyList<string> cells, IReadOnlyList<float> widths, SKFont font)
    {
        int lines = 1;
        for (int c = 0; c < cells.Count && c < widths.Count; c++)
        {
            lines = Math.Max(lines, Wrap(cells[c], font, (widths[c] * ContentWidth) - 6).Count);
        }
        return (font.Size * 1.55f) + ((lines - 1) * font.Size * 1.3f);
    }

    private void DrawRow(IReadOnlyList<string> cells, IReadOnlyList<float> widths, SKFont font, SKPaint paint)
    {
        float x = Margin;
        for (int c = 0; c < cells.Count && c < widths.Count; c++)
        {
            float w = widths[c] * ContentWidth;
            float y = _y + font.Size + 1.5f;
            foreach (string line in Wrap(cells[c], font, w - 6))
            {
                Canvas.DrawText(line, x + 3, y, SKTextAlign.Left, font, paint);
                y += font.Size * 1.3f;
            }
            x += w;
        }
        _y += RowHeight(cells, widths, font);
        Canvas.DrawLine(Margin, _y, PageWidth - Margin, _y, _rule);
    }

    private void NewPage()
    {
        EndPage();
        _canvas = _document.BeginPage(PageWidth, PageHeight);
        _page++;
        _y = Margin;
    }

    private void EndPage()
    {
        if (_canvas is null)
        {
            return;
        }
        float y = PageHeight - Margin;
        _canvas.DrawLine(Margin, y - 16, PageWidth - Margin, y - 16, _rule);
        _canvas.DrawText(Fit(_footerLeft, _small, ContentWidth * 0.75f), Margin, y - 7, SKTextAlign.Left, _small, _grey);
        _canvas.DrawText("page " + _page.ToString(System.Globalization.CultureInfo.InvariantCulture), PageWidth - Margin, y - 7, SKTextAlign.Right, _small, _grey);
        _canvas.DrawText(ReportWording.CautionShort, Margin, y + 2, SKTextAlign.Left, _small, _grey);
        _document.EndPage();
        _canvas = null;
    }

    private static string Fit(string text, SKFont font, float width)
    {
        if (font.MeasureText(text) <= width)
        {
            return text;
        }
        int length = text.Length;
        while (length > 0 && font.MeasureText(string.Concat(text.AsSpan(0, length), "…")) > width)
        {
            length--;
        }
        return string.Concat(text.AsSpan(0, length), "…");
    }

    internal static IReadOnlyList<string> Wrap(string text, SKFont font, float width)
    {
        var lines = new List<string>();
        foreach (string paragraph in text.Replace("\r", "", StringComparison.Ordinal).Split('\n'))
        {
            string current = "";
            foreach (string word in paragraph.Split(' ', StringSplitOptions.RemoveEmptyEntries))
            {
                string candidate = current.Length == 0 ? word : current + " " + word;
                if (font.MeasureText(candidate) <= width || current.Length == 0)
                {
                    current = font.MeasureText(candidate) <= width ? candidate : Fit(candidate, font, width);
                }
                else
                {
                    lines.Add(current);
                    current = font.MeasureText(word) <= width ? word : Fit(word, font, width);
                }
            }
            lines.Add(current);
        }
        return lines;
    }
}
