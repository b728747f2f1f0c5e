-- wrk's script for the scan benchmark (scripts/bench/shop-floor.ts): POST /api/scans from ten
-- stations, each job moved through blank, form (with its draws) and clean, start and complete.
-- Arguments after "--": a file whose first lines are the stations' sessions ("cookie<TAB>csrf")
-- and the rest job codes, one a line; and the number of wrk threads. Each thread takes every
-- n-th code. The moves go stage by stage over blocks of BLOCK jobs, so a job's next scan is sent
-- some hundred requests after its last one, long after that one was answered on whichever
-- connection carried it (wrk gives no way to keep a job on one connection).
local BLOCK = 256
local steps = {
  { "blank", "start", "" }, { "blank", "complete", "" }, { "form", "start", "" },
  { "form", "complete", ',"drawStagesDone":2' }, { "clean", "start", "" }, { "clean", "complete", "" },
}

local threads = {}
function setup(thread)
  thread:set("index", #threads)
  table.insert(threads, thread)
end

local sessions, codes = {}, {}
local pos, stage, base = 0, 1, 0
local checked = false

function init(args)
  local threads, i = tonumber(args[2]), 0
  for line in io.lines(args[1]) do
    local cookie, csrf = line:match("^([^\t]*)\t(.*)$")
    if cookie then
      table.insert(sessions, { cookie = cookie, csrf = csrf })
    elseif line ~= "" then
      if i % threads == index then table.insert(codes, line) end
      i = i + 1
    end
  end
end

function request()
  -- before the run wrk asks the first thread for one request to check the script, and sends none
  if index == 0 and not checked then
    checked = true
    return wrk.format("GET", "/api/health")
  end
  local k = base + pos + 1
  if k > #codes then
    -- out of jobs: the bench gives each run more than it can scan, and fails if this happens
    ranOut = true
    wrk.thread:stop()
    k = #codes
  end
  local session = sessions[k % #sessions + 1]
  local step = steps[stage]
  local body = '{"code":"' .. codes[k] .. '","step":"' .. step[1] .. '","action":"' .. step[2] .. '","station":"bench station"' .. step[3] .. "}"
  pos = pos + 1
  if pos == BLOCK or base + pos >= #codes then
    pos, stage = 0, stage + 1
    if stage > #steps then stage, base = 1, base + BLOCK end
  end
  return wrk.format("POST", "/api/scans", { ["Content-Type"] = "application/json", ["Cookie"] = session.cookie, ["X-CSRF-Token"] = session.csrf }, body)
end

-- one JSON line for the bench: answers received, those that were not 2xx or 3xx, and whether a
-- thread ran out of jobs
function done(summary)
  local e, ranOut = summary.errors, false
  for _, t in ipairs(threads) do ranOut = ranOut or t:get("ranOut") == true end
  io.write(string.format('{"requests":%d,"notOk":%d,"socketErrors":%d,"ranOut":%s}\n',
    summary.requests, e.status, e.connect + e.read + e.write + e.timeout, tostring(ranOut)))
end
