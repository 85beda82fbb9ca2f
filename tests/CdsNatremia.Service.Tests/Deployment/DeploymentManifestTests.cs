using System.Collections;
using System.Globalization;
using System.Reflection;
using System.Text.RegularExpressions;
using CdsNatremia.Audit;
using CdsNatremia.Service.Hosting;
using CdsNatremia.Service.Telemetry;
using CdsNatremia.Service.Tests.Support;
using Microsoft.AspNetCore.Routing;
using Microsoft.Extensions.DependencyInjection;
using YamlDotNet.RepresentationModel;

namespace CdsNatremia.Service.Tests.Deployment;

/// <summary>
/// The container and Kubernetes recipe cannot be built or applied here, so these tests read every manifest and the
/// Dockerfile and hold them to the service's real settings: the endpoints it maps, the option classes it binds, the
/// shutdown budget it computes. Renaming a setting or an endpoint without updating deploy/ fails here.
/// </summary>
public sealed partial class DeploymentManifestTests
{
    private static readonly string[] NonNatremiaSettings = ["ASPNETCORE_ENVIRONMENT", "Urls"];

    [Fact]
    public void EveryManifest_Parses_HasApiVersionKindAndName()
    {
        var all = Manifests.All();
        Assert.True(all.Count >= 6, $"only {all.Count} documents under deploy/");
        Assert.All(all, d =>
        {
            Assert.False(string.IsNullOrEmpty(d.Root.Text("apiVersion")), d.File);
            Assert.False(string.IsNullOrEmpty(d.Root.Text("kind")), d.File);
            Assert.False(string.IsNullOrEmpty(d.Root.Map("metadata").Text("name")), d.File);
        });
        foreach (var kind in new[] { "Deployment", "Service", "PodDisruptionBudget", "ConfigMap", "Secret" })
        {
            Assert.Contains(all, d => d.Root.Text("kind") == kind);
        }
    }

    [Fact]
    public async Task Probes_OnTheServiceHealthEndpointsAndItsHttpPort()
    {
        await using var factory = new NatremiaFactory();
        var routes = factory.Services.GetRequiredService<EndpointDataSource>().Endpoints.OfType<RouteEndpoint>()
            .Where(e => e.Metadata.GetMetadata<Microsoft.AspNetCore.Routing.HttpMethodMetadata>()?.HttpMethods.Contains("GET") == true)
            .Select(e => "/" + e.RoutePattern.RawText!.TrimStart('/'))
            .ToHashSet(StringComparer.Ordinal);
        var container = Manifests.Container();
        var httpPort = Ports(container)["http"];

        foreach (var probe in new[] { "startupProbe", "readinessProbe", "livenessProbe" })
        {
            var get = container.Map(probe).Map("httpGet");
            Assert.Contains(get.Text("path")!, routes); // a GET endpoint the service really maps
            Assert.True(get.Text("port") == "http" || get.Text("port") == httpPort.ToString(CultureInfo.InvariantCulture), $"{probe} port {get.Text("port")}");
        }

        // Readiness is the endpoint that reports "draining" after SIGTERM; liveness must not fail while draining.
        Assert.Equal(GracefulShutdown.ReadinessPath, container.Map("readinessProbe").Map("httpGet").Text("path"));
        Assert.Equal(GracefulShutdown.ReadinessPath, container.Map("startupProbe").Map("httpGet").Text("path"));
        Assert.NotEqual(GracefulShutdown.ReadinessPath, container.Map("livenessProbe").Map("httpGet").Text("path"));
    }

    [Fact]
    public void Ports_ContainerPortsAreTheListenAddressesAndTheMetricsPort()
    {
        var container = Manifests.Container();
        var (literal, _, config) = Manifests.Environment();
        var ports = Ports(container);
        var listening = UrlPorts(literal["Urls"]);

        Assert.Equal(listening.Order(), ports.Values.Order());
        var telemetry = new TelemetryOptions();
        var metricsPort = int.Parse(config[Env(TelemetryOptions.Section, nameof(TelemetryOptions.MetricsPort))], CultureInfo.InvariantCulture);
        var metricsPath = config.GetValueOrDefault(Env(TelemetryOptions.Section, nameof(TelemetryOptions.MetricsPath))) ?? telemetry.MetricsPath;
        Assert.Equal(metricsPort, ports["metrics"]);
        Assert.NotEqual(ports["http"], metricsPort);

        var annotations = Manifests.Kind("Deployment").At("spec.template.metadata.annotations").Scalars();
        Assert.Equal(metricsPort.ToString(CultureInfo.InvariantCulture), annotations["prometheus.io/port"]);
        Assert.Equal(metricsPath, annotations["prometheus.io/path"]);

        // The image listens on the same ports it exposes.
        var docker = Manifests.Dockerfile();
        var env = DockerEnv(docker);
        Assert.Equal(listening.Order(), UrlPorts(env["Urls"]).Order());
        Assert.Equal(listening.Order(), docker.Where(i => i.Keyword == "EXPOSE").SelectMany(i => i.Args.Split(' ', StringSplitOptions.RemoveEmptyEntries)).Select(p => int.Parse(p, CultureInfo.InvariantCulture)).Order());
        Assert.Equal(metricsPort.ToString(CultureInfo.InvariantCulture), env[Env(TelemetryOptions.Section, nameof(TelemetryOptions.MetricsPort))]);
    }

    [Fact]
    public void SecurityContext_NonRootReadOnlyRootNoEscalation_SameUserAsTheImage()
    {
        var pod = Manifests.Kind("Deployment").At("spec.template.spec");
        var container = Manifests.Container();
        var podSecurity = pod.Map("securityContext");
        var containerSecurity = container.Map("securityContext");

        Assert.Equal("true", podSecurity.Text("runAsNonRoot"));
        Assert.Equal("true", containerSecurity.Text("readOnlyRootFilesystem"));
        Assert.Equal("false", containerSecurity.Text("allowPrivilegeEscalation"));
        Assert.Contains("ALL", containerSecurity.Map("capabilities").Seq("drop").Cast<YamlScalarNode>().Select(n => n.Value));
        var uid = int.Parse(podSecurity.Text("runAsUser")!, CultureInfo.InvariantCulture);
        Assert.True(uid > 0);

        // The image's final stage runs as the same numeric, non-root user.
        var user = Manifests.Dockerfile().Last(i => i.Keyword == "USER").Args.Split(':')[0];
        Assert.Equal(uid.ToString(CultureInfo.InvariantCulture), user);
    }

    [Fact]
    public void Environment_EveryNatremiaSettingIsARealOptionOfTheService()
    {
        var (literal, secrets, config) = Manifests.Environment();
        var names = literal.Keys.Concat(secrets.Keys).Concat(config.Keys).Concat(DockerEnv(Manifests.Dockerfile()).Keys)
            .Where(n => !NonNatremiaSettings.Contains(n, StringComparer.Ordinal) && !n.StartsWith("DOTNET_", StringComparison.Ordinal))
            .Distinct(StringComparer.Ordinal)
            .ToList();
        Assert.True(names.Count >= 12, $"only {names.Count} settings");
        foreach (var name in names)
        {
            Assert.True(OptionExists(name.Replace("__", ":", StringComparison.Ordinal), out var problem), $"{name}: {problem}");
        }
    }

    [Fact]
    public void Secrets_PostgresPseudonymAndAdminKeysComeFromTheSecretAndItHoldsThoseKeys()
    {
        var (literal, secrets, config) = Manifests.Environment();
        var required = new[]
        {
            Env(AuditOptions.Section, nameof(AuditOptions.PostgresConnectionString)),
            Env(AuditOptions.Section, nameof(AuditOptions.PseudonymKey)),
            Env(AuditOptions.Section, nameof(AuditOptions.AdminApiKey)),
        };
        var secret = Manifests.Kind("Secret");
        var keys = secret.Map("stringData").Scalars();
        foreach (var name in required)
        {
            Assert.True(secrets.TryGetValue(name, out var reference), $"{name} must come from a Secret");
            Assert.Equal(secret.Map("metadata").Text("name"), reference.Secret);
            Assert.True(keys.ContainsKey(reference.Key), $"the Secret has no key {reference.Key}");
            Assert.False(literal.ContainsKey(name) || config.ContainsKey(name), $"{name} must not also be set in plain text");
        }

        // The example holds placeholders only, never a usable secret.
        Assert.All(keys.Values, v => Assert.Equal("REPLACE-ME", v));
    }

    [Fact]
    public void Configuration_TrustedClientsAudienceAndFhirServerAreSet()
    {
        var (_, _, config) = Manifests.Environment();
        Assert.True(Uri.TryCreate(config["Natremia__Authentication__PublicBaseUrl"], UriKind.Absolute, out var audience) && audience.Scheme == "https");
        Assert.True(Uri.TryCreate(config["Natremia__Authentication__TrustedClients__0__Issuer"], UriKind.Absolute, out _));
        Assert.True(config.ContainsKey("Natremia__Authentication__TrustedClients__0__JwksUrls__0") || config.ContainsKey("Natremia__Authentication__TrustedClients__0__Jwks"));
        Assert.Contains(config.Keys, k => k.StartsWith("Natremia__Fetching__AllowedServers__", StringComparison.Ordinal));
    }

    [Fact]
    public void Shutdown_GracePeriodCoversReadinessDelayDrainAndFlush_ReadinessFailsWithinTheDelay()
    {
        var (_, _, config) = Manifests.Environment();
        var options = new ShutdownOptions
        {
            ReadinessDelay = TimeSpan.Parse(config[Env(ShutdownOptions.Section, nameof(ShutdownOptions.ReadinessDelay))], CultureInfo.InvariantCulture),
            DrainTimeout = TimeSpan.Parse(config[Env(ShutdownOptions.Section, nameof(ShutdownOptions.DrainTimeout))], CultureInfo.InvariantCulture),
        };
        var pod = Manifests.Kind("Deployment").At("spec.template.spec");
        var grace = int.Parse(pod.Text("terminationGracePeriodSeconds")!, CultureInfo.InvariantCulture);
        Assert.True(grace >= options.Total.TotalSeconds, $"terminationGracePeriodSeconds {grace} < the service's shutdown budget {options.Total.TotalSeconds} s");

        // Kubernetes must have seen readiness fail before the server stops accepting.
        var readiness = Manifests.Container().Map("readinessProbe");
        var noticed = int.Parse(readiness.Text("periodSeconds")!, CultureInfo.InvariantCulture) * int.Parse(readiness.Text("failureThreshold")!, CultureInfo.InvariantCulture);
        Assert.True(noticed <= options.ReadinessDelay.TotalSeconds, $"readiness needs {noticed} s to fail, the service drains readiness for {options.ReadinessDelay.TotalSeconds} s");
    }

    [Fact]
    public void Volumes_DataFolderAndTmpWritable_DataFolderIsTheImageVolume()
    {
        var (literal, _, _) = Manifests.Environment();
        var dataDirectory = literal[Env(AuditOptions.Section, nameof(AuditOptions.DataDirectory))];
        var mounts = Manifests.Container().Seq("volumeMounts").Cast<YamlMappingNode>().ToDictionary(m => m.Text("mountPath")!, m => m.Text("name")!, StringComparer.Ordinal);
        var volumes = Manifests.Kind("Deployment").At("spec.template.spec").Seq("volumes").Cast<YamlMappingNode>().Select(v => v.Text("name")).ToHashSet(StringComparer.Ordinal);

        Assert.True(mounts.ContainsKey(dataDirectory), $"nothing mounted at the data folder {dataDirectory}");
        Assert.True(mounts.ContainsKey("/tmp"), "a read-only root needs a writable /tmp");
        Assert.All(mounts.Values, name => Assert.Contains(name, volumes));

        var docker = Manifests.Dockerfile();
        Assert.Contains(docker, i => i.Keyword == "VOLUME" && i.Args.Contains('"' + dataDirectory + '"', StringComparison.Ordinal));
        Assert.Equal(dataDirectory, DockerEnv(docker)[Env(AuditOptions.Section, nameof(AuditOptions.DataDirectory))]);
    }

    [Fact]
    public void Dockerfile_MultiStageKnowledgeBakedInWhereTheServiceLooks()
    {
        var docker = Manifests.Dockerfile();
        var stages = docker.Where(i => i.Keyword == "FROM").ToList();
        Assert.True(stages.Count >= 2, "multi-stage: a build stage and a runtime stage");
        Assert.Contains("sdk", stages[0].Args, StringComparison.Ordinal);
        Assert.Contains("aspnet", stages[^1].Args, StringComparison.Ordinal);

        var knowledge = DockerEnv(docker)["Natremia__KnowledgeDirectory"];
        var runtime = docker.SkipWhile(i => i != stages[^1]).ToList();
        Assert.Contains(runtime, i => i.Keyword == "COPY" && i.Args.EndsWith(" " + knowledge + "/", StringComparison.Ordinal) && i.Args.Contains("profiles", StringComparison.Ordinal));
        Assert.Equal(knowledge, Manifests.Environment().Literal["Natremia__KnowledgeDirectory"]);
        Assert.Contains(docker, i => i.Keyword == "ENTRYPOINT" && i.Args.Contains("CdsNatremia.Service.dll", StringComparison.Ordinal));
        Assert.True(File.Exists(Path.Combine(ServiceProcess.RepositoryRoot(), "src", "CdsNatremia.Service", "CdsNatremia.Service.csproj")));
    }

    [Fact]
    public void ServiceAndDisruptionBudget_SelectTheDeploymentsPods_OnlyTheHttpPortIsBalanced()
    {
        var deployment = Manifests.Kind("Deployment");
        var podLabels = deployment.At("spec.template.metadata.labels").Scalars();
        var replicas = int.Parse(deployment.Map("spec").Text("replicas")!, CultureInfo.InvariantCulture);
        Assert.True(replicas >= 2, "a fleet: at least two replicas");

        var service = Manifests.Kind("Service");
        Assert.All(service.Map("spec").Map("selector").Scalars(), l => Assert.Equal(l.Value, podLabels.GetValueOrDefault(l.Key)));
        var targets = service.Map("spec").Seq("ports").Cast<YamlMappingNode>().Select(p => p.Text("targetPort")).ToList();
        Assert.Equal(["http"], targets);
        Assert.Contains("http", Ports(Manifests.Container()).Keys);

        var budget = Manifests.Kind("PodDisruptionBudget");
        Assert.All(budget.At("spec.selector.matchLabels").Scalars(), l => Assert.Equal(l.Value, podLabels.GetValueOrDefault(l.Key)));
        var maxUnavailable = budget.Map("spec").Text("maxUnavailable");
        var minAvailable = budget.Map("spec").Text("minAvailable");
        Assert.True(maxUnavailable is not null || minAvailable is not null);
        if (maxUnavailable is not null)
        {
            Assert.InRange(int.Parse(maxUnavailable, CultureInfo.InvariantCulture), 1, replicas - 1);
        }
    }

    [Fact]
    public void Kustomization_ListsEveryManifestButTheSecretExample()
    {
        var listed = Manifests.Kind("Kustomization").Seq("resources").Cast<YamlScalarNode>().Select(n => n.Value!).Order(StringComparer.Ordinal);
        var files = Directory.EnumerateFiles(Manifests.Folder, "*.yaml").Select(Path.GetFileName)
            .Where(f => f is not ("kustomization.yaml" or "secret.example.yaml")).Order(StringComparer.Ordinal);
        Assert.Equal(files, listed);
    }

    [Fact]
    public void Resources_CpuAndMemoryRequestedMemoryLimited()
    {
        var resources = Manifests.Container().Map("resources");
        Assert.False(string.IsNullOrEmpty(resources.Map("requests").Text("cpu")));
        Assert.False(string.IsNullOrEmpty(resources.Map("requests").Text("memory")));
        Assert.False(string.IsNullOrEmpty(resources.Map("limits").Text("memory")));
    }

    private static string Env(string section, string property) => (section + ":" + property).Replace(":", "__", StringComparison.Ordinal);

    private static Dictionary<string, int> Ports(YamlMappingNode container)
        => container.Seq("ports").Cast<YamlMappingNode>().ToDictionary(p => p.Text("name")!, p => int.Parse(p.Text("containerPort")!, CultureInfo.InvariantCulture), StringComparer.Ordinal);

    private static List<int> UrlPorts(string urls)
        => urls.Split(';', StringSplitOptions.RemoveEmptyEntries).Select(u => int.Parse(u[(u.LastIndexOf(':') + 1)..].TrimEnd('/'), CultureInfo.InvariantCulture)).ToList();

    private static Dictionary<string, string> DockerEnv(IReadOnlyList<(string Keyword, string Args)> docker)
        => docker.Where(i => i.Keyword == "ENV")
            .SelectMany(i => EnvPair().Matches(i.Args))
            .ToDictionary(m => m.Groups[1].Value, m => m.Groups[2].Value.Trim('"'), StringComparer.Ordinal);

    [GeneratedRegex("""([A-Za-z_][A-Za-z0-9_]*)=("[^"]*"|\S+)""")]
    private static partial Regex EnvPair();

    /// <summary>
    /// True when a configuration key ("Natremia:Audit:PseudonymKey", "Natremia:Authentication:TrustedClients:0:Issuer")
    /// names a property of the service's options classes (found by their <c>Section</c> constant), as the binder would.
    /// </summary>
    private static bool OptionExists(string key, out string problem)
    {
        var sections = new[] { typeof(Program).Assembly, typeof(AuditOptions).Assembly }
            .SelectMany(a => a.GetTypes())
            .Select(t => (Type: t, Field: t.GetField("Section", BindingFlags.Public | BindingFlags.Static)))
            .Where(x => x.Field is { IsLiteral: true } && x.Field.FieldType == typeof(string) && x.Type.Name.EndsWith("Options", StringComparison.Ordinal))
            .Select(x => (x.Type, Section: (string)x.Field!.GetRawConstantValue()!))
            .ToList();
        var match = sections.Where(s => key.StartsWith(s.Section + ":", StringComparison.OrdinalIgnoreCase)).MaxBy(s => s.Section.Length);
        if (match.Type is null)
        {
            problem = "no options class binds this section";
            return false;
        }

        var type = match.Type;
        foreach (var segment in key[(match.Section.Length + 1)..].Split(':'))
        {
            if (int.TryParse(segment, NumberStyles.None, CultureInfo.InvariantCulture, out _))
            {
                var element = type.IsArray ? type.GetElementType() : type.GetInterfaces().Append(type).FirstOrDefault(i => i.IsGenericType && i.GetGenericTypeDefinition() == typeof(IEnumerable<>))?.GetGenericArguments()[0];
                if (element is null || type == typeof(string) || !typeof(IEnumerable).IsAssignableFrom(type))
                {
                    problem = $"'{segment}' indexes {type.Name}, which is not a list";
                    return false;
                }

                type = element;
                continue;
            }

            var property = type.GetProperty(segment, BindingFlags.Public | BindingFlags.Instance | BindingFlags.IgnoreCase);
            if (property is null)
            {
                problem = $"{type.Name} has no property '{segment}'";
                return false;
            }

            type = Nullable.GetUnderlyingType(property.PropertyType) ?? property.PropertyType;
        }

        problem = string.Empty;
        return type.IsPrimitive || type == typeof(string) || type == typeof(TimeSpan) || type == typeof(Uri) || type.IsEnum || type == typeof(decimal)
            || Fail(out problem, $"ends at {type.Name}, not a value");
    }

    private static bool Fail(out string problem, string text)
    {
        problem = text;
        return false;
    }
}
