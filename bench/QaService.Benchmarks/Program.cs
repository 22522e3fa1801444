using BenchmarkDotNet.Running;

// dotnet run -c Release --project bench/QaService.Benchmarks -- --filter '*'   (or a class name, e.g. '*Projection*')
// dotnet run -c Release --project bench/QaService.Benchmarks -- stages MARKS.csv FIXES.csv OPTIONS.json [rounds]   (see StageTimes)
// dotnet run -c Release --project bench/QaService.Benchmarks -- allocations MARKS.csv FIXES.csv OPTIONS.json   (see AllocationTypes)
// dotnet run -c Release --project bench/QaService.Benchmarks -- transform-stages BODY.json [rounds]   (see TransformStages)
if (args.Length > 0 && args[0] == "stages")
    await StageTimes.RunAsync(args);
else if (args.Length > 0 && args[0] == "transform-stages")
    await TransformStages.RunAsync(args);
else if (args.Length > 0 && args[0] == "allocations")
    await AllocationTypes.RunAsync(args);
else
    BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);
