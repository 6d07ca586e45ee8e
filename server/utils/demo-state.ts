/** Whether this process seeded the demo: 'off' unless SCHOLIUM_SEED_DEMO=1. Process state, not per-user. */
export const demoSeed: { state: 'off' | 'pending' | 'ready' | 'failed' } = { state: 'off' }
