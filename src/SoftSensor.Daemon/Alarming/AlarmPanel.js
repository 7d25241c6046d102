// The status page's alarm panel (served as /alarm-panel.js; the page only needs <section id="alarm-panel">).
// Every configured alarm with its ISA-18.2 state; for an operator, Acknowledge and Shelve buttons that post
// to /api/alarm-commands with the session's anti-forgery token. The server journals the logged-in user.
(function () {
  "use strict";
  const box = document.getElementById("alarm-panel");
  if (!box) return;
  let session = { user: null, role: null, csrf: null };
  const mayCommand = () => session.role === "operator" || session.role === "engineer";
  const el = (tag, attrs, ...kids) => {
    const e = document.createElement(tag);
    for (const [k, v] of Object.entries(attrs || {})) { if (k.startsWith("on")) e.addEventListener(k.slice(2), v); else e.setAttribute(k, v); }
    for (const k of kids) e.append(k);
    return e;
  };
  async function command(body) {
    const r = await fetch("/api/alarm-commands", {
      method: "POST", credentials: "same-origin",
      headers: { "Content-Type": "application/json", "X-CSRF-Token": session.csrf || "" },
      body: JSON.stringify(body),
    });
    let text = ""; try { text = (await r.json()).message || ""; } catch (_) { text = ""; }
    box.querySelector("#alarm-outcome").textContent = (r.ok ? "Done: " : "Refused (" + r.status + "): ") + text;
    await refresh();
  }
  async function refresh() {
    const s = await fetch("/api/session", { credentials: "same-origin" });
    if (s.ok) session = await s.json();
    const r = await fetch("/api/alarm-states", { credentials: "same-origin" });
    const outcome = box.querySelector("#alarm-outcome")?.textContent || "";
    if (!r.ok) { box.replaceChildren(el("h3", {}, "Alarms"), el("p", {}, r.status === 404 ? "no alarm rules configured" : "alarms unavailable (" + r.status + ")")); return; }
    const list = await r.json();
    const rows = list.map(a => {
      const id = "alarm-" + a.reactor + "-" + a.alarm;
      const actions = el("td", {});
      if (mayCommand()) {
        if (a.awaitingAcknowledgement) actions.append(el("button", { id: "ack-" + id, onclick: () => command({ command: "acknowledge", alarm: a.alarm, reactor: a.reactor }) }, "Acknowledge"));
        if (a.state !== "shelved" && a.state !== "out_of_service") {
          const minutes = el("input", { id: "shelve-min-" + id, type: "number", min: "1", max: "10080", value: "30", size: "4", "aria-label": "shelve minutes" });
          actions.append(" ", minutes, el("button", { id: "shelve-" + id, onclick: () => command({ command: "shelve", alarm: a.alarm, reactor: a.reactor, shelveMinutes: Number(minutes.value) }) }, "Shelve"));
        } else if (a.state === "shelved") {
          actions.append(el("button", { id: "unshelve-" + id, onclick: () => command({ command: "unshelve", alarm: a.alarm, reactor: a.reactor }) }, "Unshelve"));
        }
      }
      return el("tr", { id: id }, el("td", {}, a.reactor), el("td", {}, a.alarm), el("td", {}, a.priority), el("td", { class: "alarm-state" }, a.state), el("td", {}, a.message), actions);
    });
    const who = session.user ? "Logged in as " + session.user + " (" + session.role + ")" : "Not logged in: ";
    const login = session.user ? "" : el("a", { href: "/login?next=/" }, "log in to acknowledge or shelve");
    box.replaceChildren(el("h3", {}, "Alarms"), el("p", { class: "meta" }, who, login),
      el("table", {}, el("tr", {}, ...["reactor", "alarm", "priority", "state", "message", ""].map(h => el("th", {}, h))), ...rows),
      el("p", { id: "alarm-outcome" }, outcome));
  }
  refresh();
  setInterval(refresh, 5000);
})();
