using OpenAI.Chat;

namespace HarbourDesk.Extraction;

/// <summary>
/// .editorconfig says every call in this folder is extraction (temperance.task = extraction), whatever the names say.
/// The temperature is unset, so OpenAI's default of 1 applies: SAMP001, and the fix adds Temperature = 0.0f.
/// </summary>
public static class CrewManifest
{
    public static ChatCompletionOptions Options() => new ChatCompletionOptions { MaxOutputTokenCount = 400 };
}
