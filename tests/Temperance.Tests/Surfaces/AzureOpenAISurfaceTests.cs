using Temperance.Tests.Infrastructure;

namespace Temperance.Tests.Surfaces;

/// <summary>Azure.AI.OpenAI: the same <c>ChatCompletionOptions</c>, reached through <c>AzureOpenAIClient.GetChatClient(deployment)</c>.</summary>
public class AzureOpenAISurfaceTests
{
    [Fact]
    public async Task AzureDeploymentWithExtremeTemperature_Triggers()
    {
        await Verify.AnalyzerAsync("""
            using System;
            using System.ClientModel;
            using System.Threading.Tasks;
            using Azure.AI.OpenAI;
            using OpenAI.Chat;

            class Brochure
            {
                async Task<string> Write(string brief)
                {
                    var client = new AzureOpenAIClient(new Uri("https://contoso-travel.example"), new ApiKeyCredential("key"));
                    ChatClient chat = client.GetChatClient("brochure-writer");
                    var options = new ChatCompletionOptions { {|SAMP009:Temperature = 1.8f|} };
                    ChatCompletion result = await chat.CompleteChatAsync(new ChatMessage[] { new UserChatMessage(brief) }, options);
                    return result.Content[0].Text;
                }
            }
            """);
    }
}
