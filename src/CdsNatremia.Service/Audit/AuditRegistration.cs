using CdsNatremia.Audit;
using CdsNatremia.Audit.Pseudonyms;
using CdsNatremia.Audit.Retention;
using CdsNatremia.Audit.Storage;

namespace CdsNatremia.Service.Audit;

/// <summary>Wires the audit trail: options, pseudonym key, store (SQLite or PostgreSQL), schema start-up, purge.</summary>
public static class AuditRegistration
{
    /// <summary>
    /// Registers the audit. Resolves the pseudonym key now, so a Production host without one stops at start-up with
    /// a message that says what to configure.
    /// </summary>
    public static WebApplicationBuilder AddNatremiaAudit(this WebApplicationBuilder builder)
    {
        ArgumentNullException.ThrowIfNull(builder);
        var section = builder.Configuration.GetSection(AuditOptions.Section);
        builder.Services.AddOptions<AuditOptions>().Bind(section).ValidateDataAnnotations().ValidateOnStart();
        var options = section.Get<AuditOptions>() ?? new AuditOptions();
        var contentRoot = builder.Environment.ContentRootPath;
        var dataDirectory = AuditStoreFactory.DataDirectory(options, contentRoot);
        var key = PseudonymKeySource.Resolve(options.PseudonymKey, builder.Environment.IsDevelopment(), dataDirectory);

        var previous = PseudonymKeySource.ResolvePrevious(options.PreviousPseudonymKeys);
        builder.Services.AddSingleton(new PatientPseudonymizer(key, previous));
        builder.Services.AddSingleton(_ => AuditStoreFactory.Create(options, contentRoot));
        if (options.GroupCommit)
        {
            builder.Services.AddSingleton(sp =>
            {
                var audit = sp.GetRequiredService<Microsoft.Extensions.Options.IOptions<AuditOptions>>().Value;
                return new AuditWriteQueue(sp.GetRequiredService<IAuditStore>(), audit.WriteQueueCapacity, audit.MaxAnswersPerCommit);
            });
            builder.Services.AddSingleton(sp => new CardAudit(
                sp.GetRequiredService<IAuditStore>(), sp.GetRequiredService<PatientPseudonymizer>(), sp.GetRequiredService<CdsNatremia.Fhir.Knowledge.LoadedKnowledge>(),
                sp.GetRequiredService<AuditWriteQueue>()));
        }
        else
        {
            builder.Services.AddSingleton(sp => new CardAudit(
                sp.GetRequiredService<IAuditStore>(), sp.GetRequiredService<PatientPseudonymizer>(), sp.GetRequiredService<CdsNatremia.Fhir.Knowledge.LoadedKnowledge>()));
        }

        builder.Services.AddSingleton<RepeatSuppression>();
        builder.Services.AddHostedService<AuditStartup>();
        builder.Services.AddSingleton<AuditPurgeService>();
        builder.Services.AddHostedService(sp => sp.GetRequiredService<AuditPurgeService>());
        return builder;
    }
}
