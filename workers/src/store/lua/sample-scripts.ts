/**
 * Lua scripts for the raw random samples of sampled engines (`typical`): each sample is stored
 * once under `${branchIndex}:${sample}` — a retried block, a duplicated job or a zombie process
 * can never count a sample twice — together with a per-branch count, atomically with the
 * sweep's status check.
 */

/**
 * KEYS: record, samples, sampleCounts
 * ARGV: branchIndex, <sample index, bytes>…
 * Returns the branch's stored sample count after the write, or -1 when the sweep is not
 * queued or running (nothing is written then).
 */
export const WRITE_SAMPLES = `
local st = redis.call('HGET', KEYS[1], 'status')
if st ~= 'queued' and st ~= 'running' then return -1 end
local n = 0
for i = 2, #ARGV, 2 do
  if redis.call('HSETNX', KEYS[2], ARGV[1] .. ':' .. ARGV[i], ARGV[i + 1]) == 1 then n = n + 1 end
end
if n > 0 then return redis.call('HINCRBY', KEYS[3], ARGV[1], n) end
return tonumber(redis.call('HGET', KEYS[3], ARGV[1]) or '0')
`;
