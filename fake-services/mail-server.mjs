// @ts-check
// Fake mail service: a local stand-in for the hosted SMTP service, for development and tests.
// The app sends through nodemailer exactly as in production; this catches every message
// in memory and shows it over HTTP so a person or a test can read it.
import http from 'node:http';
import { pathToFileURL } from 'node:url';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';

const HOST = '127.0.0.1';
// Enough for a long test run; dropping the oldest keeps a dev server from growing forever.
const DEFAULT_MAX_MESSAGES = 2000;
// Generous, but stops a runaway attachment from eating the machine's memory.
const MAX_MESSAGE_BYTES = 25 * 1024 * 1024;
const PAGE_TITLE = 'Groundwork — local test inbox';

/**
 * @typedef {object} StoredMessage
 * @property {string} id
 * @property {string[]} toAddresses addresses from the To header (envelope if there is none)
 * @property {string[]} recipients every address the message went to: To, Cc and envelope
 * @property {string} from sender address
 * @property {string} fromText From header as written, with any display name
 * @property {string} toText To header as written
 * @property {string} ccText Cc header as written
 * @property {string} subject
 * @property {string} text
 * @property {string} html
 * @property {string} date ISO 8601
 * @property {string} messageId
 * @property {{ filename: string, contentType: string, size: number }[]} attachments
 */

/**
 * @typedef {object} ApiMessage
 * @property {string} id
 * @property {string} to comma-joined recipient addresses from the To header
 * @property {string} from
 * @property {string} subject
 * @property {string} text plain-text part, '' when there is none
 * @property {string} html HTML part, '' when there is none
 * @property {string} date ISO 8601
 */

/**
 * @typedef {object} MailServerOptions
 * @property {number} [smtpPort] 0 lets the OS choose; defaults to FAKE_SMTP_PORT or 1025
 * @property {number} [httpPort] 0 lets the OS choose; defaults to FAKE_MAIL_HTTP_PORT or 1080
 * @property {boolean} [quiet] true prints nothing (tests fail on console.error)
 * @property {number} [maxMessages] how many to keep before dropping the oldest; default 2000
 */

/**
 * @typedef {object} RunningMailServer
 * @property {number} smtpPort the port actually bound
 * @property {number} httpPort the port actually bound
 * @property {() => Promise<void>} close stops both servers
 */

/** @param {unknown} value */
function escapeHtml(value) {
  return String(value ?? '')
    .replaceAll('&', '&amp;')
    .replaceAll('<', '&lt;')
    .replaceAll('>', '&gt;')
    .replaceAll('"', '&quot;')
    .replaceAll("'", '&#39;');
}

/**
 * Reads a port from the environment, falling back when unset; refuses nonsense early.
 * @param {string | undefined} raw
 * @param {number} fallback
 * @param {string} name
 */
function portFromEnv(raw, fallback, name) {
  if (raw === undefined || raw.trim() === '') return fallback;
  const port = Number(raw);
  if (!Number.isInteger(port) || port < 0 || port > 65535) {
    throw new Error(`${name} must be a port number from 0 to 65535, got "${raw}"`);
  }
  return port;
}

/**
 * Flattens mailparser's address header (one object or a list of them) into plain addresses.
 * @param {import('mailparser').AddressObject | import('mailparser').AddressObject[] | undefined} header
 * @returns {string[]}
 */
function addressesOf(header) {
  const groups = header === undefined ? [] : Array.isArray(header) ? header : [header];
  /** @type {string[]} */
  const found = [];
  /** @param {import('mailparser').EmailAddress[]} entries */
  const walk = (entries) => {
    for (const entry of entries) {
      if (entry.address) found.push(entry.address);
      if (entry.group) walk(entry.group);
    }
  };
  for (const group of groups) walk(group.value);
  return found;
}

/**
 * @param {import('mailparser').AddressObject | import('mailparser').AddressObject[] | undefined} header
 */
function headerText(header) {
  if (header === undefined) return '';
  return (Array.isArray(header) ? header : [header]).map((group) => group.text).join(', ');
}

/** @param {string[]} list */
function uniqueCaseless(list) {
  const seen = new Set();
  return list.filter((item) => {
    const key = item.toLowerCase();
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

/**
 * Turns a parsed message and its SMTP envelope into what the inbox keeps.
 * @param {import('mailparser').ParsedMail} parsed
 * @param {import('smtp-server').SMTPServerEnvelope} envelope
 * @param {string} id
 * @returns {StoredMessage}
 */
function toStoredMessage(parsed, envelope, id) {
  const envelopeTo = envelope.rcptTo.map((rcpt) => rcpt.address);
  const headerTo = addressesOf(parsed.to);
  const fromAddresses = addressesOf(parsed.from);
  const envelopeFrom = envelope.mailFrom ? envelope.mailFrom.address : '';
  // A message without a usable Date header still needs a time for sorting and display.
  const date = parsed.date && !Number.isNaN(parsed.date.getTime()) ? parsed.date : new Date();
  return {
    id,
    toAddresses: headerTo.length > 0 ? headerTo : envelopeTo,
    recipients: uniqueCaseless([...headerTo, ...addressesOf(parsed.cc), ...envelopeTo]),
    from: fromAddresses.join(', ') || envelopeFrom,
    fromText: headerText(parsed.from) || envelopeFrom,
    toText: headerText(parsed.to),
    ccText: headerText(parsed.cc),
    subject: parsed.subject ?? '',
    text: parsed.text ?? '',
    html: typeof parsed.html === 'string' ? parsed.html : '',
    date: date.toISOString(),
    messageId: parsed.messageId ?? '',
    attachments: parsed.attachments.map((file) => ({
      filename: file.filename ?? '(unnamed)',
      contentType: file.contentType,
      size: file.size,
    })),
  };
}

/**
 * @param {StoredMessage} message
 * @returns {ApiMessage}
 */
function toApiMessage(message) {
  return {
    id: message.id,
    to: message.toAddresses.join(', '),
    from: message.from,
    subject: message.subject,
    text: message.text,
    html: message.html,
    date: message.date,
  };
}

/**
 * Keeps messages in arrival order, capped, with ids that are never reused.
 * @param {number} maxMessages
 */
function createMailbox(maxMessages) {
  /** @type {StoredMessage[]} */
  let messages = [];
  let nextId = 1;
  return {
    nextId: () => String(nextId++),
    /** @param {StoredMessage} message */
    add(message) {
      messages.push(message);
      if (messages.length > maxMessages) messages = messages.slice(-maxMessages);
    },
    /** @param {string | null} recipient */
    list(recipient) {
      if (!recipient) return [...messages];
      const wanted = recipient.trim().toLowerCase();
      return messages.filter((m) => m.recipients.some((r) => r.toLowerCase() === wanted));
    },
    /** @param {string} id */
    find: (id) => messages.find((m) => m.id === id),
    clear() {
      messages = [];
    },
  };
}

/** @typedef {ReturnType<typeof createMailbox>} Mailbox */

/**
 * @param {Mailbox} mailbox
 * @param {(line: string) => void} log
 */
function createSmtpServer(mailbox, log) {
  return new SMTPServer({
    secure: false,
    // Development only: no TLS to configure, and any credentials the app was given are fine.
    disabledCommands: ['STARTTLS'],
    hideSTARTTLS: true,
    authOptional: true,
    allowInsecureAuth: true,
    authMethods: ['PLAIN', 'LOGIN', 'CRAM-MD5'],
    logger: false,
    size: MAX_MESSAGE_BYTES,
    closeTimeout: 1000,
    // Every client is local; a reverse DNS lookup per connection only adds delay.
    disableReverseLookup: true,
    onAuth(auth, _session, callback) {
      callback(null, { user: auth.username || 'anyone' });
    },
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          if (stream.sizeExceeded) {
            callback(Object.assign(new Error('Message too large for the fake inbox'), { responseCode: 552 }));
            return;
          }
          const message = toStoredMessage(parsed, session.envelope, mailbox.nextId());
          mailbox.add(message);
          log(`mail #${message.id} to ${message.toAddresses.join(', ')}: ${message.subject}`);
          callback();
        })
        .catch((/** @type {Error} */ error) => callback(error));
    },
  });
}

/**
 * @param {http.ServerResponse} res
 * @param {number} status
 * @param {unknown} body
 */
function sendJson(res, status, body) {
  res.writeHead(status, { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store' });
  res.end(JSON.stringify(body));
}

/**
 * Errors use the app's one error shape so test helpers can read them the same way.
 * @param {http.ServerResponse} res
 * @param {number} status
 * @param {string} code
 * @param {string} message
 */
function sendError(res, status, code, message) {
  sendJson(res, status, { error: { code, message } });
}

/**
 * @param {http.ServerResponse} res
 * @param {number} status
 * @param {string} html
 */
function sendHtml(res, status, html) {
  res.writeHead(status, {
    'content-type': 'text/html; charset=utf-8',
    'cache-control': 'no-store',
    // Belt and braces: the page has no scripts of its own, so none may run at all.
    'content-security-policy': "script-src 'none'; object-src 'none'",
    'x-content-type-options': 'nosniff',
  });
  res.end(html);
}

/** @param {string} iso */
function formatDate(iso) {
  return new Intl.DateTimeFormat('en-GB', {
    dateStyle: 'medium',
    timeStyle: 'medium',
    timeZone: 'Europe/London',
  }).format(new Date(iso));
}

const PAGE_STYLE = `
  :root { --ink: #1f2a2e; --muted: #5b6b70; --line: #d9e1e3; --paper: #f6f8f7; --card: #fff; --accent: #1d6b5f; }
  * { box-sizing: border-box; }
  body { margin: 0; font-family: system-ui, -apple-system, "Segoe UI", sans-serif; color: var(--ink); background: var(--paper); line-height: 1.45; }
  header { background: var(--accent); color: #fff; padding: 0.9rem 1.25rem; display: flex; align-items: baseline; gap: 0.75rem; flex-wrap: wrap; }
  header a { color: #fff; text-decoration: none; font-weight: 700; font-size: 1.15rem; }
  header span { opacity: 0.85; font-size: 0.95rem; }
  main { max-width: 60rem; margin: 0 auto; padding: 1.25rem; }
  a { color: var(--accent); }
  a:focus-visible { outline: 3px solid #e0a526; outline-offset: 2px; }
  .note { color: var(--muted); font-size: 0.9rem; }
  table { width: 100%; border-collapse: collapse; background: var(--card); border: 1px solid var(--line); }
  th, td { text-align: left; padding: 0.55rem 0.75rem; border-bottom: 1px solid var(--line); vertical-align: top; font-size: 0.95rem; }
  th { background: #eef3f2; font-weight: 600; }
  td.date { white-space: nowrap; color: var(--muted); }
  dl { display: grid; grid-template-columns: max-content 1fr; gap: 0.3rem 1rem; background: var(--card); border: 1px solid var(--line); padding: 0.9rem 1rem; margin: 0 0 1.25rem; }
  dt { font-weight: 600; color: var(--muted); }
  dd { margin: 0; overflow-wrap: anywhere; }
  h1 { font-size: 1.35rem; margin: 0 0 1rem; overflow-wrap: anywhere; }
  h2 { font-size: 1.05rem; margin: 1.5rem 0 0.5rem; }
  iframe { width: 100%; min-height: 28rem; border: 1px solid var(--line); background: #fff; }
  pre { white-space: pre-wrap; overflow-wrap: anywhere; background: var(--card); border: 1px solid var(--line); padding: 0.9rem 1rem; margin: 0; font-size: 0.9rem; }
`;

/**
 * @param {string} heading
 * @param {string} body already-escaped HTML
 */
function renderPage(heading, body) {
  return `<!doctype html>
<html lang="en-GB">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(heading === PAGE_TITLE ? PAGE_TITLE : `${heading} · ${PAGE_TITLE}`)}</title>
<style>${PAGE_STYLE}</style>
</head>
<body>
<header><a href="/">Groundwork</a><span>local test inbox: nothing here was really sent</span></header>
<main>
${body}
</main>
</body>
</html>`;
}

/** @param {StoredMessage[]} messages oldest first, as stored */
function renderInbox(messages) {
  const rows = [...messages]
    .reverse()
    .map(
      (m) => `<tr>
<td><a href="/messages/${encodeURIComponent(m.id)}">${escapeHtml(m.subject || '(no subject)')}</a></td>
<td>${escapeHtml(m.toAddresses.join(', '))}</td>
<td>${escapeHtml(m.from)}</td>
<td class="date"><time datetime="${escapeHtml(m.date)}">${escapeHtml(formatDate(m.date))}</time></td>
</tr>`,
    )
    .join('\n');
  const list =
    messages.length === 0
      ? '<p>No messages yet. Anything the app sends while this is running will appear here.</p>'
      : `<table>
<thead><tr><th scope="col">Subject</th><th scope="col">To</th><th scope="col">From</th><th scope="col">Received</th></tr></thead>
<tbody>
${rows}
</tbody>
</table>`;
  return renderPage(
    PAGE_TITLE,
    `<h1>${escapeHtml(PAGE_TITLE)}</h1>
<p class="note">${messages.length} message${messages.length === 1 ? '' : 's'}, newest first. <a href="/">Refresh</a> · <a href="/api/messages">JSON</a></p>
${list}`,
  );
}

/**
 * Escapes plain text and turns web addresses into links, so sign-in links can be followed.
 * @param {string} text
 */
function linkifyText(text) {
  return text
    .split(/(https?:\/\/[^\s<>"']+)/g)
    .map((part, index) => {
      // split() with one capture group puts the matched URLs at the odd positions.
      if (index % 2 === 0) return escapeHtml(part);
      const url = part.replace(/[.,;:!?)\]]+$/, '');
      const trailing = part.slice(url.length);
      return `<a href="${escapeHtml(url)}" target="_blank" rel="noopener noreferrer">${escapeHtml(url)}</a>${escapeHtml(trailing)}`;
    })
    .join('');
}

/** @param {StoredMessage} m */
function renderMessage(m) {
  /** @type {[string, string][]} */
  const headers = [
    ['From', m.fromText],
    ['To', m.toText || m.toAddresses.join(', ')],
    ['Cc', m.ccText],
    ['Delivered to', m.recipients.join(', ')],
    ['Date', `${formatDate(m.date)} (${m.date})`],
    ['Message-ID', m.messageId],
    ['Attachments', m.attachments.map((a) => `${a.filename} (${a.contentType}, ${a.size} bytes)`).join('; ')],
  ];
  const headerList = headers
    .filter(([, value]) => value !== '')
    .map(([name, value]) => `<dt>${escapeHtml(name)}</dt><dd>${escapeHtml(value)}</dd>`)
    .join('\n');
  // No allow-scripts: mail HTML never runs code here. The base target sends links to a new tab.
  const htmlPart = m.html
    ? `<iframe title="HTML part of the message" sandbox="allow-popups allow-popups-to-escape-sandbox" srcdoc="${escapeHtml(`<base target="_blank">${m.html}`)}"></iframe>`
    : '<p class="note">This message has no HTML part.</p>';
  const textPart = m.text ? `<pre>${linkifyText(m.text)}</pre>` : '<p class="note">This message has no plain-text part.</p>';
  return renderPage(
    m.subject || '(no subject)',
    `<p class="note"><a href="/">← Back to the inbox</a></p>
<h1>${escapeHtml(m.subject || '(no subject)')}</h1>
<dl>
${headerList}
</dl>
<h2>HTML part</h2>
${htmlPart}
<h2>Plain-text part</h2>
${textPart}`,
  );
}

/**
 * Routes one request. Paths: /, /messages/:id, /api/messages, /api/messages/:id.
 * @param {Mailbox} mailbox
 * @param {http.IncomingMessage} req
 * @param {http.ServerResponse} res
 */
function handleRequest(mailbox, req, res) {
  const url = new URL(req.url ?? '/', 'http://localhost');
  const method = req.method ?? 'GET';
  const path = url.pathname.replace(/\/+$/, '') || '/';
  const apiMatch = /^\/api\/messages\/([^/]+)$/.exec(path);
  const pageMatch = /^\/messages\/([^/]+)$/.exec(path);

  if (path === '/api/messages') {
    if (method === 'GET') return sendJson(res, 200, mailbox.list(url.searchParams.get('to')).map(toApiMessage));
    if (method === 'DELETE') {
      mailbox.clear();
      res.writeHead(204, { 'cache-control': 'no-store' });
      return res.end();
    }
    res.setHeader('allow', 'GET, DELETE');
    return sendError(res, 405, 'method_not_allowed', 'Use GET to list messages or DELETE to clear them.');
  }
  if (method !== 'GET') {
    res.setHeader('allow', 'GET');
    return sendError(res, 405, 'method_not_allowed', 'Only GET is supported here.');
  }
  if (apiMatch) {
    const message = mailbox.find(decodeURIComponent(apiMatch[1]));
    if (!message) return sendError(res, 404, 'not_found', 'No message with that id.');
    return sendJson(res, 200, toApiMessage(message));
  }
  if (path === '/') return sendHtml(res, 200, renderInbox(mailbox.list(null)));
  if (pageMatch) {
    const message = mailbox.find(decodeURIComponent(pageMatch[1]));
    if (message) return sendHtml(res, 200, renderMessage(message));
    return sendHtml(res, 404, renderPage('Not found', '<h1>Message not found</h1><p><a href="/">Back to the inbox</a></p>'));
  }
  return sendError(res, 404, 'not_found', 'Nothing here. Try / or /api/messages.');
}

/**
 * Listens on 127.0.0.1 and resolves with the port actually bound (useful when asked for 0).
 * @param {{ listen: (port: number, host: string, cb: () => void) => unknown }} server
 * @param {import('node:net').Server} netServer the underlying net server, for errors and address
 * @param {number} port
 * @returns {Promise<number>}
 */
function listenOn(server, netServer, port) {
  return new Promise((resolve, reject) => {
    const onError = (/** @type {Error} */ error) => reject(error);
    netServer.once('error', onError);
    server.listen(port, HOST, () => {
      netServer.off('error', onError);
      const address = netServer.address();
      resolve(typeof address === 'object' && address ? address.port : port);
    });
  });
}

/**
 * Starts the fake SMTP server and its HTTP inbox on 127.0.0.1.
 *
 * @example
 * const mail = await startMailServer({ smtpPort: 0, httpPort: 0, quiet: true });
 * // send with nodemailer to 127.0.0.1:mail.smtpPort, then
 * // await fetch(`http://127.0.0.1:${mail.httpPort}/api/messages`);
 * await mail.close();
 *
 * @param {MailServerOptions} [options]
 * @returns {Promise<RunningMailServer>}
 */
export async function startMailServer(options = {}) {
  const smtpPortWanted = options.smtpPort ?? portFromEnv(process.env.FAKE_SMTP_PORT, 1025, 'FAKE_SMTP_PORT');
  const httpPortWanted = options.httpPort ?? portFromEnv(process.env.FAKE_MAIL_HTTP_PORT, 1080, 'FAKE_MAIL_HTTP_PORT');
  const log = options.quiet ? () => {} : (/** @type {string} */ line) => console.log(`[fake-mail] ${line}`);

  const maxMessages = options.maxMessages ?? DEFAULT_MAX_MESSAGES;
  if (!Number.isInteger(maxMessages) || maxMessages < 1) throw new Error('maxMessages must be a whole number of 1 or more');
  const mailbox = createMailbox(maxMessages);
  const smtp = createSmtpServer(mailbox, log);
  // Without a listener an SMTP socket error would crash the process; here it is only noise.
  smtp.on('error', (error) => log(`smtp error: ${error.message}`));
  const web = http.createServer((req, res) => handleRequest(mailbox, req, res));

  const smtpPort = await listenOn(smtp, smtp.server, smtpPortWanted);
  /** @type {number} */
  let httpPort;
  try {
    httpPort = await listenOn(web, web, httpPortWanted);
  } catch (error) {
    await new Promise((resolve) => smtp.close(() => resolve(undefined)));
    throw error;
  }

  let closing = /** @type {Promise<void> | null} */ (null);
  const close = () => {
    closing ??= Promise.all([
      new Promise((resolve) => smtp.close(() => resolve(undefined))),
      new Promise((resolve) => {
        web.close(() => resolve(undefined));
        // Keep-alive connections from fetch would otherwise hold close() open.
        web.closeAllConnections();
      }),
    ]).then(() => undefined);
    return closing;
  };
  return { smtpPort, httpPort, close };
}

/** True when this file is run with `node fake-services/mail-server.mjs`, not imported. */
function isRunDirectly() {
  const script = process.argv[1];
  return script !== undefined && import.meta.url === pathToFileURL(script).href;
}

if (isRunDirectly()) {
  const running = await startMailServer();
  console.log(
    `[fake-mail] SMTP on smtp://${HOST}:${running.smtpPort} · inbox at http://${HOST}:${running.httpPort}/`,
  );
  const stop = () => {
    running.close().then(
      () => process.exit(0),
      () => process.exit(1),
    );
  };
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
}
