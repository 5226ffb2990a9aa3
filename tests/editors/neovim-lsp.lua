-- Observes, headless, what the README's Neovim snippet (loaded as init.lua) did: the client it
-- started for the netlist opened on the command line, that client's diagnostics and a hover; then
-- opens a second netlist of the same folder, which must reuse that client. Nothing here starts a
-- client. Arguments come from the environment: RECTILENS_OUT (a JSON file to write),
-- RECTILENS_HOVER_WORD (a word of the first file to hover over), RECTILENS_SECOND (the second
-- netlist's path). Written for 0.7 and newer.
local out_path = os.getenv('RECTILENS_OUT')
local result = { clients = {}, diagnostics = {}, second = { clients = {}, diagnostics = {} }, hover = '' }
local WAIT_MS = 15000

local function finish()
  local file = io.open(out_path, 'w')
  file:write(vim.fn.json_encode(result))
  file:close()
  vim.cmd('qa!')
end

local function clients_of(bufnr)
  if vim.lsp.get_clients then return vim.lsp.get_clients({ bufnr = bufnr }) end
  local list = {}
  for _, client in pairs(vim.lsp.buf_get_clients(bufnr)) do table.insert(list, client) end
  return list
end

local function describe_clients(bufnr)
  local list = {}
  for _, client in ipairs(clients_of(bufnr)) do
    table.insert(list, { id = client.id, name = client.name, root_dir = client.config.root_dir })
  end
  return list
end

local function diagnostics_of(bufnr)
  vim.wait(WAIT_MS, function() return #vim.diagnostic.get(bufnr) > 0 end, 20)
  local list = {}
  for _, d in ipairs(vim.diagnostic.get(bufnr)) do
    table.insert(list, { lnum = d.lnum, col = d.col, severity = d.severity, message = d.message, code = d.code, source = d.source })
  end
  return list
end

local ok, err = pcall(function()
  local bufnr = vim.api.nvim_get_current_buf()
  result.filetype = vim.bo[bufnr].filetype
  vim.wait(WAIT_MS, function() return #clients_of(bufnr) > 0 end, 20)
  result.clients = describe_clients(bufnr)
  result.diagnostics = diagnostics_of(bufnr)

  -- Hover over the first occurrence of the chosen word outside a comment line.
  local word = os.getenv('RECTILENS_HOVER_WORD')
  for lnum, line in ipairs(vim.api.nvim_buf_get_lines(bufnr, 0, -1, false)) do
    local col = string.find(line, word, 1, true)
    if col and not string.match(line, '^%*') then
      local params = { textDocument = vim.lsp.util.make_text_document_params(bufnr), position = { line = lnum - 1, character = col } }
      for _, response in pairs(vim.lsp.buf_request_sync(bufnr, 'textDocument/hover', params, WAIT_MS) or {}) do
        if response.result and response.result.contents then
          local contents = response.result.contents
          result.hover = type(contents) == 'table' and (contents.value or '') or tostring(contents)
        end
      end
      break
    end
  end

  vim.cmd('edit ' .. vim.fn.fnameescape(os.getenv('RECTILENS_SECOND')))
  local second = vim.api.nvim_get_current_buf()
  result.second.filetype = vim.bo[second].filetype
  vim.wait(WAIT_MS, function() return #clients_of(second) > 0 end, 20)
  result.second.clients = describe_clients(second)
  result.second.diagnostics = diagnostics_of(second)
  local running = 0
  for _, client in pairs((vim.lsp.get_clients or vim.lsp.get_active_clients)()) do
    if client.name == 'rectilens' then running = running + 1 end
  end
  result.running = running
end)
if not ok then result.error = tostring(err) end
finish()
