// The traveller core: what each station kind does (station-kinds), where a traveller stands at a
// moment (phase), and the scan guards that decide every event and close every step (../guards).
// WIP, loads, reports, the tablet, the seed and the simulator all ask this core.
export * from './station-kinds';
export * from './phase';
export * from '../guards';
export * from './replay';
