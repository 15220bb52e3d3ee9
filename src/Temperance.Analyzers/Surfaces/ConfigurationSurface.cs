namespace Temperance.Surfaces
{
    /// <summary>
    /// How .NET configuration reaches an options class of the project (Microsoft.Extensions.Configuration, .Options): the
    /// calls that bind a class to a section, how sections and keys are spelled, and which files hold the values.
    /// </summary>
    /// <remarks>
    /// Facts relied on (https://learn.microsoft.com/dotnet/core/extensions/configuration, checked 2026-12-02): the default
    /// host reads appsettings.json, then appsettings.{Environment}.json, and a provider added later overrides earlier values;
    /// hierarchical keys are joined with ':'. Keys are case-insensitive (https://learn.microsoft.com/aspnet/core/fundamentals/configuration,
    /// "Keys are case-insensitive", checked 2026-12-02).
    /// </remarks>
    internal static class ConfigurationSurface
    {
        /// <summary>The configuration abstraction: a compilation without it binds nothing, so the scan is skipped.</summary>
        public const string ConfigurationType = "Microsoft.Extensions.Configuration.IConfiguration";

        /// <summary>Calls that name a section by a constant key (<c>configuration.GetSection("HarbourLlm")</c>); chained ones nest ("A:B").</summary>
        public static readonly string[] SectionMethods = { "GetSection", "GetRequiredSection" };

        /// <summary><c>services.Configure&lt;T&gt;(section)</c>, and <c>AddOptions&lt;T&gt;().Configure(o =&gt; section.Bind(o))</c>.</summary>
        public const string ConfigureMethod = "Configure";

        /// <summary><c>services.AddOptions&lt;T&gt;()</c>: the options builder that <see cref="BindMethod"/> and <see cref="BindConfigurationMethod"/> follow.</summary>
        public const string AddOptionsMethod = "AddOptions";

        /// <summary><c>AddOptions&lt;T&gt;().Bind(section)</c>, <c>section.Bind(instance)</c> and <c>configuration.Bind("Key", instance)</c>.</summary>
        public const string BindMethod = "Bind";

        /// <summary><c>AddOptions&lt;T&gt;().BindConfiguration("Key")</c>: the section by its key.</summary>
        public const string BindConfigurationMethod = "BindConfiguration";

        /// <summary><c>section.Get&lt;T&gt;()</c>: a new instance bound to the section.</summary>
        public const string GetMethod = "Get";

        /// <summary><c>[ConfigurationKeyName("temp")]</c> on a property: the key it is bound from instead of its name.</summary>
        public const string KeyNameAttribute = "ConfigurationKeyNameAttribute";

        /// <summary>Joins the keys of a hierarchy ("HarbourLlm:Temperature").</summary>
        public const char KeySeparator = ':';

        /// <summary>appsettings.json and appsettings.{Environment}.json, in the content root (the project directory).</summary>
        public const string FileStem = "appsettings";
        public const string FileExtension = ".json";
    }
}
