/**
 * Lua scripts of the Redis job store. Each runs atomically, so a status check and the write
 * it guards can never interleave with another process (a retry, a zombie, a cancel).
 * Keys are passed in KEYS; the one exception (the dedupe target in `createSweep`) builds a
 * record key from a prefix, which is fine on a single Redis or a sentinel pair.
 */

/**
 * KEYS: record, ownerSweeps, ownerActive, ownerSpec, events, branches, unqueued
 * ARGV: id, fresh(0|1), maxActive, createdAtMs, recordKeyPrefix, recordKeySuffix, streamMaxLen,
 *       statusEventJson, nRecordPairs, <record field, value>…, <branch index, json>…
 * Returns {'created', id} | {'existing', id} | {'capped', activeCount}.
 */
export const CREATE_SWEEP = `
if ARGV[2] == '0' then
  local existing = redis.call('GET', KEYS[4])
  if existing then
    local st = redis.call('HGET', ARGV[5] .. existing .. ARGV[6], 'status')
    if st and st ~= 'failed' and st ~= 'cancelled' then return {'existing', existing} end
  end
end
local cap = tonumber(ARGV[3])
if cap > 0 then
  local active = redis.call('SCARD', KEYS[3])
  if active >= cap then return {'capped', tostring(active)} end
end
local n = tonumber(ARGV[9])
local i = 10
local last = 9 + 2 * n
while i < last do
  redis.call('HSET', KEYS[1], ARGV[i], ARGV[i + 1])
  i = i + 2
end
while i < #ARGV do
  redis.call('HSET', KEYS[6], ARGV[i], ARGV[i + 1])
  i = i + 2
end
redis.call('HSET', KEYS[1], 'dedupeKey', KEYS[4])
redis.call('ZADD', KEYS[2], ARGV[4], ARGV[1])
redis.call('SADD', KEYS[3], ARGV[1])
redis.call('SET', KEYS[4], ARGV[1])
redis.call('ZADD', KEYS[7], math.floor(tonumber(ARGV[4]) / 1000), ARGV[1])
redis.call('XADD', KEYS[5], 'MAXLEN', '~', ARGV[7], '*', 'type', 'status', 'data', ARGV[8])
return {'created', ARGV[1]}
`;

/**
 * KEYS: record, points, thermo, diag, events, progress, pointsCounter, versions
 * ARGV: streamMaxLen, branchIndex, <kind, field, version, json>…
 * Version 0: HSETNX (the first write wins). Version v > 0: replaces a record stored with a lower
 * version (kept in `versions` under `${kind}:${field}`), never a version-0 one, and is ignored
 * otherwise. Every stored write appends its stream event; a point counts as new (progress,
 * counter, return value) only on its first write.
 * Returns the number of new points, or -1 when the sweep is not queued or running.
 */
export const WRITE_RECORDS = `
local st = redis.call('HGET', KEYS[1], 'status')
if st ~= 'queued' and st ~= 'running' then return -1 end
local n = 0
for i = 3, #ARGV, 4 do
  local kind = ARGV[i]
  local field = ARGV[i + 1]
  local version = tonumber(ARGV[i + 2])
  local json = ARGV[i + 3]
  local h = KEYS[4]
  if kind == 'point' then h = KEYS[2] elseif kind == 'thermo' then h = KEYS[3] end
  local fresh = false
  local stored = false
  if version == 0 then
    fresh = redis.call('HSETNX', h, field, json) == 1
    stored = fresh
  else
    local vkey = kind .. ':' .. field
    local old = tonumber(redis.call('HGET', KEYS[8], vkey))
    local exists = redis.call('HEXISTS', h, field) == 1
    if (old == nil and not exists) or (old ~= nil and old < version) then
      redis.call('HSET', h, field, json)
      redis.call('HSET', KEYS[8], vkey, version)
      fresh = not exists
      stored = true
    end
  end
  if stored then
    redis.call('XADD', KEYS[5], 'MAXLEN', '~', ARGV[1], '*', 'type', kind, 'data', json)
    if kind == 'point' and fresh then
      redis.call('HINCRBY', KEYS[6], ARGV[2], 1)
      n = n + 1
    end
  end
end
if n > 0 then redis.call('INCRBY', KEYS[7], n) end
return n
`;

/**
 * KEYS: record, events, ownerActive, result, <other per-sweep keys to expire>…
 * ARGV: newStatus, allowedFrom (comma list), nowIso, retentionSeconds, error, streamMaxLen,
 *       statusEventJson, resultJson ('' for none), terminal(0|1)
 * Returns 1 when the status changed, else 0.
 */
export const TRANSITION = `
local st = redis.call('HGET', KEYS[1], 'status')
if not st then return 0 end
if not string.find(',' .. ARGV[2] .. ',', ',' .. st .. ',', 1, true) then return 0 end
redis.call('HSET', KEYS[1], 'status', ARGV[1])
if ARGV[1] == 'running' and redis.call('HGET', KEYS[1], 'startedAt') == '' then
  redis.call('HSET', KEYS[1], 'startedAt', ARGV[3])
end
if ARGV[8] ~= '' then redis.call('SET', KEYS[4], ARGV[8]) end
if ARGV[9] == '1' then
  redis.call('HSET', KEYS[1], 'finishedAt', ARGV[3])
  if ARGV[5] ~= '' then redis.call('HSET', KEYS[1], 'error', ARGV[5]) end
  local id = redis.call('HGET', KEYS[1], 'id')
  redis.call('SREM', KEYS[3], id)
end
redis.call('XADD', KEYS[2], 'MAXLEN', '~', ARGV[6], '*', 'type', 'status', 'data', ARGV[7])
if ARGV[9] == '1' then
  local ttl = tonumber(ARGV[4])
  if ttl > 0 then
    for i = 1, #KEYS do
      if i ~= 3 then redis.call('EXPIRE', KEYS[i], ttl) end
    end
    local dk = redis.call('HGET', KEYS[1], 'dedupeKey')
    local id = redis.call('HGET', KEYS[1], 'id')
    if dk and redis.call('GET', dk) == id then redis.call('EXPIRE', dk, ttl) end
  end
end
return 1
`;

/**
 * KEYS: record, branches, events, done
 * ARGV: index, branchJson, streamMaxLen, eventJson, mode ('start' | 'update' | 'progress' | 'finish'), nowIso
 * 'start' refuses (returns {0}) unless the sweep is queued or running and moves queued → running.
 * 'progress' refuses (returns {0}) once the branch is in the done set (a late progress report of
 * a sampled branch must not undo its finish). 'finish' adds the index to the done set.
 * Returns {ok, doneCount, branchCount}.
 */
export const BRANCH_STATE = `
local st = redis.call('HGET', KEYS[1], 'status')
if not st then return {0, 0, 0} end
local mode = ARGV[5]
if mode == 'start' then
  if st ~= 'queued' and st ~= 'running' then return {0, 0, 0} end
  if st == 'queued' then
    redis.call('HSET', KEYS[1], 'status', 'running', 'startedAt', ARGV[6])
    redis.call('XADD', KEYS[3], 'MAXLEN', '~', ARGV[3], '*', 'type', 'status',
      'data', cjson.encode({status = 'running', at = ARGV[6]}))
  end
end
if mode == 'progress' and redis.call('SISMEMBER', KEYS[4], ARGV[1]) == 1 then return {0, 0, 0} end
redis.call('HSET', KEYS[2], ARGV[1], ARGV[2])
if mode == 'finish' then redis.call('SADD', KEYS[4], ARGV[1]) end
redis.call('XADD', KEYS[3], 'MAXLEN', '~', ARGV[3], '*', 'type', 'branch', 'data', ARGV[4])
return {1, redis.call('SCARD', KEYS[4]), tonumber(redis.call('HGET', KEYS[1], 'branchCount'))}
`;

/**
 * KEYS: points
 * ARGV: timeCount, <betaIndex>…
 * Returns, per β index given, how many leading time indices 0, 1, … are stored without a gap.
 */
export const STORED_COUNTS = `
local out = {}
local nt = tonumber(ARGV[1])
for i = 2, #ARGV do
  local b = ARGV[i]
  local t = 0
  while t < nt and redis.call('HEXISTS', KEYS[1], b .. ':' .. t) == 1 do t = t + 1 end
  out[#out + 1] = t
end
return out
`;

/**
 * Lua function sweep_state(record, branches, progress, full): full = '1' for the whole record
 * hash (HGETALL), '0' for its changing fields only. Returns {record (flat HGETALL, or status,
 * startedAt, finishedAt, error, check), branches flat, progress flat}. Shared by SWEEP_STATE
 * and the API gate's one-call status read (services/api/src/gatekeeper.ts).
 */
export const SWEEP_STATE_FN = `
local function sweep_state(rk, bk, pk, full)
  local rec
  if full == '1' then
    rec = redis.call('HGETALL', rk)
  else
    rec = redis.call('HMGET', rk, 'status', 'startedAt', 'finishedAt', 'error', 'check')
  end
  return {rec, redis.call('HGETALL', bk), redis.call('HGETALL', pk)}
end
`;

/**
 * KEYS: record, branches, progress
 * ARGV: '1' for the whole record hash, '0' for its changing fields only
 * Returns sweep_state's answer: one command per status read instead of a MULTI of three.
 */
export const SWEEP_STATE = `${SWEEP_STATE_FN}
return sweep_state(KEYS[1], KEYS[2], KEYS[3], ARGV[1])
`;
