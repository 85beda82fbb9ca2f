using System.Globalization;
using System.Text;
using System.Text.Json;
using System.Text.RegularExpressions;

namespace CdsNatremia.Cli.InputCheck;

/// <summary>
/// Where each <c>entry[i].resource</c> sits in the file the user gave: its own text and the line and column it starts
/// at, so a problem found in a resource is reported at its place in that file, not in a re-serialised copy.
/// </summary>
internal sealed partial class ResourceSpans
{
    private readonly Dictionary<int, (string Text, int Line, int Column)> _spans = [];

    /// <summary>Finds the resources of a Bundle's entries in <paramref name="json"/> (valid JSON).</summary>
    public ResourceSpans(string json)
    {
        ArgumentNullException.ThrowIfNull(json);
        var bytes = Encoding.UTF8.GetBytes(json);
        var reader = new Utf8JsonReader(bytes, new JsonReaderOptions { CommentHandling = JsonCommentHandling.Skip });
        var entry = -1;
        while (reader.Read())
        {
            if (reader.CurrentDepth == 1 && reader.TokenType == JsonTokenType.PropertyName && reader.ValueTextEquals("entry"))
            {
                reader.Read();
                if (reader.TokenType != JsonTokenType.StartArray)
                {
                    reader.Skip();
                    continue;
                }

                while (reader.Read() && reader.TokenType != JsonTokenType.EndArray)
                {
                    entry++;
                    if (reader.TokenType != JsonTokenType.StartObject)
                    {
                        reader.Skip();
                        continue;
                    }

                    while (reader.Read() && reader.TokenType != JsonTokenType.EndObject)
                    {
                        var isResource = reader.ValueTextEquals("resource");
                        reader.Read();
                        if (isResource && reader.TokenType == JsonTokenType.StartObject)
                        {
                            var start = (int)reader.TokenStartIndex;
                            reader.Skip();
                            var end = (int)reader.BytesConsumed;
                            var (line, column) = Position(bytes, start);
                            _spans[entry] = (Encoding.UTF8.GetString(bytes, start, end - start), line, column);
                        }
                        else
                        {
                            reader.Skip();
                        }
                    }
                }
            }
            else if (reader.CurrentDepth == 1 && reader.TokenType == JsonTokenType.PropertyName)
            {
                reader.Read();
                reader.Skip();
            }
        }
    }

    /// <summary>The resource of entry <paramref name="index"/> as written in the file, or null when it has none.</summary>
    public string? Text(int index) => _spans.TryGetValue(index, out var span) ? span.Text : null;

    /// <summary>
    /// Rewrites "line L, position P" (counted within the resource's own text, as the FHIR parser reports them) as
    /// "line X, column Y of the file".
    /// </summary>
    public string InFile(int index, string message)
    {
        ArgumentNullException.ThrowIfNull(message);
        if (!_spans.TryGetValue(index, out var span))
        {
            return message;
        }

        return LinePosition().Replace(message, m =>
        {
            var line = int.Parse(m.Groups[1].Value, CultureInfo.InvariantCulture);
            var position = int.Parse(m.Groups[2].Value, CultureInfo.InvariantCulture);
            var fileLine = span.Line + line - 1;
            var fileColumn = line == 1 ? span.Column + position - 1 : position;
            return string.Create(CultureInfo.InvariantCulture, $"line {fileLine}, column {fileColumn} of the file");
        });
    }

    /// <summary>1-based line and column (in characters) of a byte offset.</summary>
    public static (int Line, int Column) Position(byte[] bytes, int offset)
    {
        ArgumentNullException.ThrowIfNull(bytes);
        var line = 1;
        var lineStart = 0;
        for (var i = 0; i < offset; i++)
        {
            if (bytes[i] == (byte)'\n')
            {
                line++;
                lineStart = i + 1;
            }
        }

        return (line, Encoding.UTF8.GetCharCount(bytes, lineStart, offset - lineStart) + 1);
    }

    [GeneratedRegex(@"line (\d+), position (\d+)")]
    private static partial Regex LinePosition();
}
