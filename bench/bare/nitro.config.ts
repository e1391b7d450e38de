// The yardstick: a bare Nitro app with one JSON route, built and measured in the same run as the app,
// so every figure of the app is printed as a ratio to what this machine does with no work at all.
export default defineNitroConfig({
  compatibilityDate: '2026-01-01',
  preset: 'node-server',
})
