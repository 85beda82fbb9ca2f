using CdsNatremia.Service.Tests.Support;
using YamlDotNet.RepresentationModel;

namespace CdsNatremia.Service.Tests.Deployment;

/// <summary>The Kubernetes manifests under deploy/kubernetes and the Dockerfile, read from the repository.</summary>
internal static class Manifests
{
    public static string Folder => Path.Combine(ServiceProcess.RepositoryRoot(), "deploy", "kubernetes");

    public static string DockerfilePath => Path.Combine(ServiceProcess.RepositoryRoot(), "Dockerfile");

    /// <summary>Every YAML document of every file under deploy/, with its file name.</summary>
    public static IReadOnlyList<(string File, YamlMappingNode Root)> All()
    {
        var documents = new List<(string, YamlMappingNode)>();
        foreach (var file in Directory.EnumerateFiles(Path.Combine(ServiceProcess.RepositoryRoot(), "deploy"), "*.yaml", SearchOption.AllDirectories).Order(StringComparer.Ordinal))
        {
            var stream = new YamlStream();
            using (var reader = new StreamReader(file))
            {
                stream.Load(reader);
            }

            documents.AddRange(stream.Documents.Select(d => (Path.GetFileName(file), (YamlMappingNode)d.RootNode)));
        }

        return documents;
    }

    public static YamlMappingNode Kind(string kind) => All().Single(d => d.Root.Text("kind") == kind).Root;

    public static YamlMappingNode Map(this YamlNode node, string key)
        => node is YamlMappingNode map && map.Children.TryGetValue(new YamlScalarNode(key), out var child) && child is YamlMappingNode m
            ? m
            : throw new KeyNotFoundException($"no mapping '{key}'");

    public static YamlSequenceNode Seq(this YamlNode node, string key)
        => node is YamlMappingNode map && map.Children.TryGetValue(new YamlScalarNode(key), out var child) && child is YamlSequenceNode s
            ? s
            : throw new KeyNotFoundException($"no sequence '{key}'");

    public static string? Text(this YamlNode node, string key)
        => node is YamlMappingNode map && map.Children.TryGetValue(new YamlScalarNode(key), out var child) && child is YamlScalarNode s ? s.Value : null;

    public static bool Has(this YamlNode node, string key)
        => node is YamlMappingNode map && map.Children.ContainsKey(new YamlScalarNode(key));

    /// <summary>Follows a dotted path of mapping keys ("spec.template.spec").</summary>
    public static YamlMappingNode At(this YamlNode node, string path)
        => path.Split('.').Aggregate((YamlMappingNode)node, (current, key) => current.Map(key));

    public static IReadOnlyDictionary<string, string> Scalars(this YamlMappingNode map)
        => map.Children.Where(c => c.Value is YamlScalarNode).ToDictionary(c => ((YamlScalarNode)c.Key).Value!, c => ((YamlScalarNode)c.Value).Value ?? string.Empty, StringComparer.Ordinal);

    /// <summary>The single container of the Deployment.</summary>
    public static YamlMappingNode Container() => (YamlMappingNode)Kind("Deployment").At("spec.template.spec").Seq("containers").Single();

    /// <summary>Environment of the container: literal values, secret references and the ConfigMap's keys.</summary>
    public static (Dictionary<string, string> Literal, Dictionary<string, (string Secret, string Key)> Secrets, Dictionary<string, string> FromConfigMap) Environment()
    {
        var container = Container();
        var literal = new Dictionary<string, string>(StringComparer.Ordinal);
        var secrets = new Dictionary<string, (string, string)>(StringComparer.Ordinal);
        foreach (var item in container.Seq("env").Cast<YamlMappingNode>())
        {
            var name = item.Text("name")!;
            if (item.Has("valueFrom"))
            {
                var reference = item.Map("valueFrom").Map("secretKeyRef");
                secrets[name] = (reference.Text("name")!, reference.Text("key")!);
            }
            else
            {
                literal[name] = item.Text("value")!;
            }
        }

        var fromConfigMap = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var source in container.Seq("envFrom").Cast<YamlMappingNode>())
        {
            var name = source.Map("configMapRef").Text("name");
            var configMap = All().Single(d => d.Root.Text("kind") == "ConfigMap" && d.Root.Map("metadata").Text("name") == name).Root;
            foreach (var (key, value) in configMap.Map("data").Scalars())
            {
                fromConfigMap[key] = value;
            }
        }

        return (literal, secrets, fromConfigMap);
    }

    /// <summary>The Dockerfile's instructions (continuation lines joined, comments dropped) as (keyword, rest).</summary>
    public static IReadOnlyList<(string Keyword, string Args)> Dockerfile()
    {
        var lines = new List<(string, string)>();
        var pending = string.Empty;
        foreach (var raw in File.ReadAllLines(DockerfilePath))
        {
            var line = raw.Trim();
            if (line.StartsWith('#') || line.Length == 0)
            {
                continue;
            }

            if (line.EndsWith('\\'))
            {
                pending += line[..^1] + " ";
                continue;
            }

            line = pending + line;
            pending = string.Empty;
            var space = line.IndexOf(' ', StringComparison.Ordinal);
            lines.Add((line[..space].ToUpperInvariant(), line[(space + 1)..].Trim()));
        }

        return lines;
    }
}
