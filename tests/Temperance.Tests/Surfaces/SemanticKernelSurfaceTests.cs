using Temperance.Model;
using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Surfaces;

/// <summary>Semantic Kernel: typed <c>OpenAIPromptExecutionSettings</c> (double) and string-keyed <c>ExtensionData</c>.</summary>
public class SemanticKernelSurfaceTests
{
    [Fact]
    public async Task OpenAISettingsTemperatureAboveTwo_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using Microsoft.SemanticKernel.Connectors.OpenAI;

            class Newsletter
            {
                OpenAIPromptExecutionSettings Settings() => new OpenAIPromptExecutionSettings { {|SAMP005:Temperature = 2.4|}, MaxTokens = 400 };
            }
            """);
    }

    [Fact]
    public async Task AzureSettingsDeriveFromOpenAISettings_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using Microsoft.SemanticKernel.Connectors.AzureOpenAI;

            class Newsletter
            {
                AzureOpenAIPromptExecutionSettings Settings() => new AzureOpenAIPromptExecutionSettings { {|SAMP009:Temperature = 1.7|} };
            }
            """);
    }

    [Fact]
    public async Task ExtensionDataKeys_Trigger()
    {
        await Verify.AnalyzerAsync("""
            using System.Collections.Generic;
            using Microsoft.SemanticKernel;

            class Newsletter
            {
                PromptExecutionSettings Settings() => new PromptExecutionSettings
                {
                    ModelId = "gpt-4o",
                    ExtensionData = new Dictionary<string, object> { {|SAMP005:["top_p"] = 1.4|}, {|SAMP009:["temperature"] = 1.9|} },
                };

                PromptExecutionSettings WithAdd() => new PromptExecutionSettings
                {
                    ExtensionData = new Dictionary<string, object> { {|SAMP009:{ "temperature", 1.9 }|} },
                };
            }
            """);
    }

    [Fact]
    public async Task ExtensionDataIndexerAfterCreation_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using System.Collections.Generic;
            using Microsoft.SemanticKernel;

            class Newsletter
            {
                PromptExecutionSettings Settings()
                {
                    var settings = new PromptExecutionSettings { ExtensionData = new Dictionary<string, object>() };
                    {|SAMP005:settings.ExtensionData["top_p"] = -0.1|};
                    return settings;
                }
            }
            """);
    }

    [Fact]
    public void ExtensionData_IsReadIntoTheRequest()
    {
        var request = Extract.Single("""
            using System.Collections.Generic;
            using Microsoft.SemanticKernel;

            class Newsletter
            {
                PromptExecutionSettings Settings() => new PromptExecutionSettings
                {
                    ModelId = "gpt-4o",
                    ExtensionData = new Dictionary<string, object> { ["Temperature"] = 0.4, ["seed"] = 11L },
                };
            }
            """);
        Assert.Equal("gpt-4o", request.ModelId);
        Assert.Equal((ValueKind.Known, 0.4), request.Setting(Setting.Temperature));
        Assert.Equal((ValueKind.Known, 11d), request.Setting(Setting.Seed));
    }
}
