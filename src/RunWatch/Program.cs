using RunWatch.Commands;

return await CommandCatalog.Build().Parse(args).InvokeAsync().ConfigureAwait(false);
