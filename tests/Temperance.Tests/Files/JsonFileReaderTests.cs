using Microsoft.CodeAnalysis.Text;
using Temperance.Files;

namespace Temperance.Tests.Files;

/// <summary>The JSON front end: spans as written, comments and trailing commas taken, and the same verdict from the quick check.</summary>
public class JsonFileReaderTests
{
    [Theory]
    [InlineData("{ // settings\n \"A\": { \"B\": 1, }, }")]
    [InlineData("/* header */ [1, 2,]")]
    [InlineData("{}")]
    public void CommentsAndTrailingCommas_Parse_InBothReaders(string json)
    {
        Assert.NotNull(JsonFileReader.Read(SourceText.From(json), out var error));
        Assert.Null(error);
        Assert.Null(JsonFileReader.Validate(json));
    }

    [Theory]
    [InlineData("{ \"a\": 1 \"b\": 2 }")]
    [InlineData("{ \"a\": 1 } { \"b\": 2 }")]
    [InlineData("{ \"a\": [1, 2 }")]
    [InlineData("{ \"a\": ")]
    public void Malformed_GivesTheSameError_FromBothReaders(string json)
    {
        Assert.Null(JsonFileReader.Read(SourceText.From(json), out var error));
        Assert.NotNull(error);
        var quick = JsonFileReader.Validate(json);
        Assert.NotNull(quick);
        Assert.Equal((error!.Line, error.Column), (quick!.Line, quick.Column));
    }

    [Fact]
    public void Spans_CoverKeysAndValuesAsWritten()
    {
        const string json = "{\n  \"execution_settings\": { \"default\": { \"top_p\": 0.50, \"name\": \"a\\\"b\" } }\n}";
        var text = SourceText.From(json);
        var root = JsonFileReader.Read(text, out _)!;
        var block = root.At("execution_settings", "default")!;
        var topP = block.Entry("TOP_P")!; // keys match ignoring case, as the configuration binder does
        Assert.Equal("\"top_p\"", text.ToString(topP.KeySpan));
        Assert.Equal("0.50", text.ToString(topP.Value.Span));
        Assert.Equal("\"top_p\": 0.50,", text.ToString(topP.Removal).Trim());
        Assert.Equal("\"a\\\"b\"", text.ToString(block.Entry("name")!.Value.Span));
        Assert.Equal("a\"b", block.TextOf("name"));
    }
}
