using System.Reflection;

namespace SoftSensor.Core.Tests.Architecture;

/// <summary>Keeps SoftSensor.Core free of infrastructure (DEVELOPERS.md: Core → MathNet.Numerics only).</summary>
public class CoreDependencyTests
{
    [Fact]
    public void Core_references_only_the_runtime_and_MathNet()
    {
        var core = typeof(SoftSensor.Core.Chemistry.Formula).Assembly;
        var names = core.GetReferencedAssemblies().Select(a => a.Name!).ToList();
        var foreign = names.Where(n => !(n.StartsWith("System", StringComparison.Ordinal)
                                          || n == "netstandard" || n == "mscorlib"
                                          || n.StartsWith("MathNet.Numerics", StringComparison.Ordinal)))
            .ToList();
        Assert.True(foreign.Count == 0, "Core references: " + string.Join(", ", foreign));
    }

    [Fact]
    public void Core_uses_no_clock_console_or_file_system()
    {
        // Read the IL's member references would need Mono.Cecil; instead ban the types by name
        // through the assembly's referenced types in method bodies is not available via reflection,
        // so check the surface: no public member of Core exposes a clock, a stream or a logger.
        var core = typeof(SoftSensor.Core.Chemistry.Formula).Assembly;
        var banned = new[] { typeof(TimeProvider), typeof(Stream), typeof(TextWriter), typeof(FileInfo) };
        var offenders = core.GetExportedTypes()
            .SelectMany(t => t.GetMembers(BindingFlags.Public | BindingFlags.Instance | BindingFlags.Static | BindingFlags.DeclaredOnly))
            .Where(m => m switch
            {
                MethodInfo mi => mi.GetParameters().Any(p => banned.Contains(p.ParameterType)) || banned.Contains(mi.ReturnType),
                PropertyInfo pi => banned.Contains(pi.PropertyType),
                _ => false,
            })
            .Select(m => m.DeclaringType!.Name + "." + m.Name)
            .ToList();
        Assert.True(offenders.Count == 0, "Core members touching I/O or a clock: " + string.Join(", ", offenders));
    }
}
