using System.Text;

namespace Temperance.Benchmarks;

/// <summary>
/// Generates a project of a given size. "dense": one LLM request per ~50 lines, mixing the value flows the rules look at;
/// "quiet": the same ordinary code in a project that references the SDKs but makes no request (what the filter costs);
/// "none": the same ordinary code with no request and no LLM SDK.
/// </summary>
public enum ProjectKind
{
    Dense,
    Quiet,
    None,
}

public static class SyntheticProject
{
    private const int LinesPerMethod = 50;
    private const int MethodsPerFile = 10;

    public static List<string> Generate(int lines, ProjectKind kind)
    {
        var methods = Math.Max(1, lines / LinesPerMethod);
        var files = new List<string>();
        for (var file = 0; file * MethodsPerFile < methods; file++)
        {
            var text = new StringBuilder();
            text.AppendLine("using System;").AppendLine("using System.Collections.Generic;").AppendLine("using System.Linq;");
            if (kind != ProjectKind.None)
            {
                text.AppendLine("using OpenAI.Chat;").AppendLine("using Microsoft.Extensions.AI;").AppendLine("using OllamaSharp.Models;");
            }

            text.AppendLine($"namespace Ferry.Module{file};").AppendLine($"public sealed class Service{file}").AppendLine("{");
            text.AppendLine("    private const float Calm = 0.2f;").AppendLine("    private static readonly float Lively = 1.7f;");
            for (var m = 0; m < MethodsPerFile && file * MethodsPerFile + m < methods; m++)
            {
                var index = file * MethodsPerFile + m;
                Filler(text, index);
                if (kind == ProjectKind.Dense)
                {
                    Request(text, index);
                }
            }

            text.AppendLine("}");
            files.Add(text.ToString());
        }

        return files;
    }

    /// <summary>Ordinary code: loops, LINQ, string work, a switch; about 40 lines.</summary>
    private static void Filler(StringBuilder text, int index)
    {
        text.AppendLine($"    public int Tally{index}(IReadOnlyList<string> manifest, int threshold)");
        text.AppendLine("    {");
        text.AppendLine("        var total = 0;");
        text.AppendLine("        var seen = new HashSet<string>(StringComparer.OrdinalIgnoreCase);");
        text.AppendLine("        foreach (var line in manifest)");
        text.AppendLine("        {");
        text.AppendLine("            if (string.IsNullOrWhiteSpace(line) || !seen.Add(line)) { continue; }");
        text.AppendLine("            var parts = line.Split(';');");
        text.AppendLine("            if (parts.Length < 2) { continue; }");
        text.AppendLine("            if (int.TryParse(parts[1], out var weight) && weight > threshold)");
        text.AppendLine("            {");
        text.AppendLine("                total += weight;");
        text.AppendLine("            }");
        text.AppendLine("            else");
        text.AppendLine("            {");
        text.AppendLine("                total += parts[0].Length;");
        text.AppendLine("            }");
        text.AppendLine("        }");
        text.AppendLine("        var heavy = manifest.Where(l => l.Contains(\"crate\")).Select(l => l.Trim()).OrderBy(l => l).ToList();");
        text.AppendLine("        var label = heavy.Count switch");
        text.AppendLine("        {");
        text.AppendLine("            0 => \"none\",");
        text.AppendLine("            1 => \"single\",");
        text.AppendLine("            _ => \"many\",");
        text.AppendLine("        };");
        text.AppendLine("        var builder = new System.Text.StringBuilder();");
        text.AppendLine("        for (var i = 0; i < heavy.Count; i++)");
        text.AppendLine("        {");
        text.AppendLine("            builder.Append(heavy[i]).Append(i % 2 == 0 ? ',' : ';');");
        text.AppendLine("        }");
        text.AppendLine("        var dictionary = new Dictionary<string, object> { [\"label\"] = label, [\"count\"] = heavy.Count };");
        text.AppendLine("        if (dictionary.Count > threshold) { total -= threshold; }");
        text.AppendLine("        return total + builder.Length + label.Length;");
        text.AppendLine("    }");
        text.AppendLine();
    }

    /// <summary>One request, cycling through the shapes and value flows the extraction follows; about 10 lines.</summary>
    private static void Request(StringBuilder text, int index)
    {
        switch (index % 6)
        {
            case 0:
                text.AppendLine($"    public ChatCompletionOptions Extract{index}() => new ChatCompletionOptions {{ Temperature = 0.9f, TopP = 0.8f }};");
                break;
            case 1:
                text.AppendLine($"    public ChatOptions Options{index}(bool playful)");
                text.AppendLine("    {");
                text.AppendLine("        var options = new ChatOptions { ModelId = \"gpt-4o-mini\" };");
                text.AppendLine("        options.Temperature = playful ? Lively : Calm;");
                text.AppendLine("        return options;");
                text.AppendLine("    }");
                break;
            case 2:
                text.AppendLine($"    public RequestOptions Local{index}() => new RequestOptions {{ Temperature = 2.5f, TopK = 1 }};");
                break;
            case 3:
                text.AppendLine($"    public ChatOptions Tuned{index}(float configured) => new ChatOptions {{ Temperature = configured, TopP = 1.4f }};");
                break;
            case 4:
                text.AppendLine($"    public ChatOptions Copy{index}(ChatOptions source) {{ var copy = source.Clone(); copy.TopK = 40; return copy; }}");
                break;
            default:
                text.AppendLine($"    public ChatCompletionOptions Summarize{index}() => new ChatCompletionOptions {{ Temperature = Calm }};");
                break;
        }

        text.AppendLine();
    }
}
