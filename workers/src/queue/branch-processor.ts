/** The sandboxed branch processor with the sweep runner's engines (see create-branch-processor.ts). */
import { createBranchProcessor } from './create-branch-processor.js';

export default createBranchProcessor();
