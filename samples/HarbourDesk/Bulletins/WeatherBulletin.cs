using System.ClientModel;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Options;
using OpenAI.Chat;

namespace HarbourDesk.Bulletins;

/// <summary>Sampling for the passengers' weather bulletin, bound from the "Bulletin" section of appsettings.</summary>
public sealed class BulletinOptions
{
    public float Temperature { get; set; } = 0.3f;
}

public static class BulletinSetup
{
    public static IServiceCollection AddBulletins(this IServiceCollection services, IConfiguration configuration) =>
        services.Configure<BulletinOptions>(configuration.GetSection("Bulletin"));
}

/// <summary>
/// Turns the marine forecast into a short notice for the departure screens. The temperature comes from configuration:
/// appsettings.json keeps it calm, and appsettings.Production.json was raised by someone testing "livelier" wording.
/// </summary>
public sealed class WeatherBulletin(IOptions<BulletinOptions> options, ChatClient client)
{
    public Task<ClientResult<ChatCompletion>> DraftAsync(string forecast) =>
        client.CompleteChatAsync(
            new ChatMessage[] { new UserChatMessage("Summarize this marine forecast in two sentences for ferry passengers: " + forecast) },
            new ChatCompletionOptions { Temperature = options.Value.Temperature });
}
