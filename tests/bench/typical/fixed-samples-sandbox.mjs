// Bootstrap of the fixed-sample-count benchmark processor (see fixed-samples-processor.ts).
import { register } from 'tsx/esm/api';

register();
const mod = await import('./fixed-samples-processor.ts');
export default mod.default;
