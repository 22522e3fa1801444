using BenchmarkDotNet.Running;

// dotnet run -c Release --project bench/QaService.Benchmarks -- --filter '*'   (or a class name, e.g. '*Projection*')
BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);
