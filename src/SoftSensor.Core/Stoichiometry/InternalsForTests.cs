using System.Runtime.CompilerServices;

// The property tests drive the balance kernel with random matrices (scaled rows, random splits).
[assembly: InternalsVisibleTo("SoftSensor.Core.Tests")]
