// JS bootstrap of the sandboxed branch processor: BullMQ forks a child that imports this
// file; it registers tsx so the TypeScript processor loads without a build step.
// (A deployment may point the worker at the compiled dist/…/branch-processor.js instead.)
import { register } from 'tsx/esm/api';

register();
const mod = await import('./branch-processor.ts');
export default mod.default;
