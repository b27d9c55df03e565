// esbuild options every Node-side bundle shares (CLI, bench, extension host, fit worker, in-host tests).
export const nodeBundle = {
  bundle: true,
  platform: 'node',
  format: 'cjs',
  target: 'node20',
  sourcemap: true,
  logLevel: 'warning',
};
