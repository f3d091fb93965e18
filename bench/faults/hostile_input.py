#!/usr/bin/env python3
"""The long form of HostileInputTest: the bad-input corpus against a daemon that is already running.

First sends every API route under odd spellings of its path (matrix parameters, escapes, dot
segments, doubled slashes, case, a backslash, the absolute form) without a token, each of which
must be refused (400, 401 or 404), as AccessPathSpellingTest does in the build; then posts
every quote file of bench/faults/corpus/quotes (in the table's order, with the content type the
table gives) to POST /api/quotes, checks each answer against expected-quotes.tsv (status, accepted,
duplicates, reasons, first detail), checks
after every file that the daemon still answers /q/health/live, then sends the oversized requests
(a body past the 16M limit, a batch of 20,001 quotes), runs `./slopewatch vet-policy` on the policy
corpus against expected-policies.tsv, sends every policy file as a what-if's policy (POST
/api/what-if: the same first problem, in an answer of at most 128 KiB), sends the quiet period, lift and
acknowledgement bodies of bench/faults/corpus/alerting against expected-alerting.tsv (the accepted
quiet periods last a minute; acknowledgements go to the newest alert, and are skipped when there is none)
and, with --policy-file, tries a few hostile policies through the live reload and puts the file
back. Prints one line per input and a summary with timings; exits 1 when an answer differs from
its expectation. Standard library only (python3).

The corpus's message ids ("corpus-…") get a suffix of this run, so that a second run against the
same daemon finds them unseen, as the duplicate files expect.
"""
import argparse
import http.client
import json
import pathlib
import subprocess
import sys
import time
import urllib.error
import urllib.parse
import urllib.request

ROOT = pathlib.Path(__file__).resolve().parents[2]
CORPUS = ROOT / "bench" / "faults" / "corpus"
RELOAD_FILES = ["p19-billion-laughs.yaml", "p12-deep-flow-nesting.yaml", "p27-expression-in-message.yaml",
                "p30-nul-escape-in-message.yaml", "p37-webhook-url-in-policy.yaml", "p39-aliases-of-a-long-text.yaml"]
MAX_ANSWER = 128 * 1024


def table(name):
    rows = []
    for line in (CORPUS / name).read_text(encoding="utf-8").splitlines():
        if line.strip() and not line.startswith("#"):
            rows.append(line.split("\t"))
    return rows


def request(url, token, method="GET", body=None, content_type=None):
    """Returns (status, text, seconds)."""
    req = urllib.request.Request(url, data=body, method=method)
    if token:
        req.add_header("Authorization", "Bearer " + token)
    if content_type:
        req.add_header("Content-Type", content_type)
    started = time.monotonic()
    try:
        with urllib.request.urlopen(req, timeout=120) as r:
            return r.status, r.read().decode("utf-8", "replace"), time.monotonic() - started
    except urllib.error.HTTPError as e:
        return e.code, e.read().decode("utf-8", "replace"), time.monotonic() - started


def oversized(base, token):
    """A body past the body limit, announced by Content-Length and Expect: 100-continue, never sent."""
    u = urllib.parse.urlsplit(base)
    conn = http.client.HTTPConnection(u.hostname, u.port or 80, timeout=60)
    conn.putrequest("POST", "/api/quotes")
    conn.putheader("Content-Type", "application/json")
    conn.putheader("Content-Length", str(17 << 20))
    conn.putheader("Expect", "100-continue")
    if token:
        conn.putheader("Authorization", "Bearer " + token)
    conn.endheaders()
    status = conn.getresponse().status
    conn.close()
    return status


def quotes(base, token):
    run = ("corpus-%x-" % int(time.time() * 1000)).encode()
    failures = 0
    total = 0.0
    slowest = (0.0, "")
    rows = table("expected-quotes.tsv")
    for f, kind, category, status, accepted, duplicates, reasons, detail in rows:
        body = (CORPUS / f).read_bytes().replace(b'"corpus-', b'"' + run)
        code, text, seconds = request(base + "/api/quotes", token, "POST", body, kind)
        total += seconds
        slowest = max(slowest, (seconds, f))
        try:
            answer = json.loads(text)
        except ValueError:
            answer = {}
        got_reasons = [e.get("reason") for e in answer.get("errors", [])]
        first = answer["errors"][0]["detail"] if answer.get("errors") else "-"
        want_reasons = [] if reasons == "-" else reasons.split(",")
        ok = (code == int(status) and answer.get("accepted") == int(accepted) and answer.get("duplicates") == int(duplicates)
              and got_reasons == want_reasons and (first == "-" if detail == "-" else detail in first))
        alive, _, _ = request(base + "/q/health/live", None)
        ok = ok and alive == 200
        failures += 0 if ok else 1
        print("%-4s %-45s %-14s HTTP %d accepted=%s duplicates=%s reasons=%s %6.0f ms%s" % (
            "ok" if ok else "FAIL", f, category, code, answer.get("accepted"), answer.get("duplicates"),
            ",".join(got_reasons) or "-", seconds * 1000, "" if alive == 200 else "  (health check: HTTP %d)" % alive))
        if not ok:
            print("     expected HTTP %s accepted=%s duplicates=%s reasons=%s detail containing %r; got %s" % (
                status, accepted, duplicates, reasons, detail, text[:400]))
    print("quotes: %d files, %d answered otherwise than expected; %.2f s in all, mean %.0f ms, slowest %.0f ms (%s)" % (
        len(rows), failures, total, 1000 * total / len(rows), 1000 * slowest[0], slowest[1]))

    code = oversized(base, token)
    print("%-4s body of 17 MiB (past the 16M limit): HTTP %d" % ("ok" if code == 413 else "FAIL", code))
    failures += 0 if code == 413 else 1
    many = ("[" + ",".join(['{"curve":"GOVT-A","tenor":"10Y","date":"2026-03-05","yield":4.2}'] * 20001) + "]").encode()
    code, text, seconds = request(base + "/api/quotes", token, "POST", many, "application/json")
    print("%-4s batch of 20,001 quotes (past slopewatch.ingest.max-batch): HTTP %d in %.0f ms" % (
        "ok" if code == 413 else "FAIL", code, seconds * 1000))
    failures += 0 if code == 413 else 1
    return failures


def policies(launcher):
    rows = table("expected-policies.tsv")
    started = time.monotonic()
    run = subprocess.run([launcher, "vet-policy", str(CORPUS / "policies")], capture_output=True, text=True, cwd=ROOT)
    seconds = time.monotonic() - started
    failures = 0 if run.returncode == 2 else 1
    for f, category, outcome, position, message in rows:
        path = str(CORPUS / f)
        ok = (path + ": policy sound: ") in run.stdout if outcome == "accepted" else \
            any(line.startswith(path + ":" + position + ": ") and message in line for line in run.stderr.splitlines())
        failures += 0 if ok else 1
        print("%-4s %-50s %-13s %s" % ("ok" if ok else "FAIL", f, category, "accepted" if outcome == "accepted" else position + " " + message))
    print("policies: %d files through vet-policy in %.2f s (exit code %d, expected 2), %d answered otherwise than expected" % (
        len(rows), seconds, run.returncode, failures))
    return failures


def whatif(base, token):
    rows = table("expected-policies.tsv")
    failures = 0
    for f, category, outcome, position, message in rows:
        text = (CORPUS / f).read_bytes().decode("utf-8", "replace")
        code, answer, seconds = request(base + "/api/what-if", token, "POST", json.dumps({"policy": text}).encode(), "application/json")
        if outcome == "accepted":
            ok = code in (202, 429)
        elif not text.strip():
            ok = code == 400 and "give the policy to try" in answer
        else:
            try:
                first = (json.loads(answer).get("problems") or [""])[0]
            except ValueError:
                first = ""
            ok = code == 400 and first.startswith("policy:" + position + ": ") and message in first
        ok = ok and len(answer) <= MAX_ANSWER
        failures += 0 if ok else 1
        print("%-4s what-if %-42s HTTP %d, %d characters in %.0f ms" % ("ok" if ok else "FAIL", f, code, len(answer), seconds * 1000))
    print("what-if: %d policies, %d answered otherwise than expected" % (len(rows), failures))
    return failures


def alerting(base, token):
    rows = table("expected-alerting.tsv")
    code, text, _ = request(base + "/api/quiet-periods", token, "POST", json.dumps(
        {"rule": "stale-feed", "lasts": "PT1M", "note": "hostile-input run: to be lifted", "set_by": "hostile-input"}).encode(),
        "application/json")
    period = json.loads(text)["id"] if code == 201 else None
    code, text, _ = request(base + "/api/alerts?limit=1", token)
    recent = json.loads(text).get("recent", []) if code == 200 else []
    alert = recent[0]["id"] if recent else None
    failures = 0
    for f, category, kind, status, error in rows:
        body = (CORPUS / f).read_bytes()
        if kind == "quiet-period":
            code, answer, seconds = request(base + "/api/quiet-periods", token, "POST", body, "application/json")
        elif kind == "ack":
            if alert is None:
                print("skip %-45s no alert to acknowledge yet" % f)
                continue
            code, answer, seconds = request(base + "/api/alerts/" + urllib.parse.quote(alert, safe="~:") + "/ack", token, "POST", body,
                                            "application/json")
        else:
            if period is None:
                print("skip %-45s no quiet period of this run to lift" % f)
                continue
            by = urllib.parse.quote(json.loads(body)["lifted_by"])
            code, answer, seconds = request(base + "/api/quiet-periods/%d?lifted_by=%s" % (period, by), token, "DELETE")
        try:
            said = json.loads(answer).get("detail", "") if answer.startswith("{") else ""
        except ValueError:
            said = ""
        ok = code == int(status) and (error == "-" or error in said) and len(answer) <= MAX_ANSWER
        failures += 0 if ok else 1
        print("%-4s %-45s %-12s %-4s HTTP %d %6.0f ms%s" % ("ok" if ok else "FAIL", f, category, kind, code, seconds * 1000,
                                                             "" if ok else "  expected %s %r; got %s" % (status, error, answer[:300])))
    print("alerting: %d bodies, %d answered otherwise than expected" % (len(rows), failures))
    return failures


def reload(base, token, policy_file):
    path = pathlib.Path(policy_file)
    original = path.read_bytes()
    failures = 0
    try:
        for name in RELOAD_FILES:
            path.write_bytes((CORPUS / "policies" / name).read_bytes())
            code, text, seconds = request(base + "/api/policy/reload", token, "POST")
            ok = code == 422 and '"rejected"' in text
            failures += 0 if ok else 1
            print("%-4s reload %-42s HTTP %d in %.0f ms" % ("ok" if ok else "FAIL", name, code, seconds * 1000))
    finally:
        path.write_bytes(original)
    code, text, _ = request(base + "/api/policy/reload", token, "POST")
    print("%-4s reload of the original file: HTTP %d %s" % ("ok" if code == 200 else "FAIL", code, text[:120]))
    return failures + (0 if code == 200 else 1)


# The API's reads and writes for the path check (AccessPathSpellingTest walks every route of the
# compiled resources; this list is the same kind of walk for a daemon that is already running).
READ_ROUTES = [("/api/spreads", ""), ("/api/alerts", ""), ("/api/transitions", ""), ("/api/rejects", ""), ("/api/curves", ""),
               ("/api/quiet-periods", ""), ("/api/export/observations", ""), ("/api/export/transitions", ""), ("/api/export/alerts", ""),
               ("/api/spreads/GOVT-A:10Y-3M", ""), ("/api/spreads/GOVT-A:10Y-3M/history", ""),
               ("/api/spreads/GOVT-A:10Y-3M/timeline", ""), ("/api/curves/GOVT-A", "?on_or_before=2099-12-31"),
               ("/api/report", "?spread=GOVT-A:10Y-3M"), ("/q/openapi", "")]
WRITE_ROUTES = [("POST", "/api/quotes"), ("POST", "/api/policy/reload"), ("POST", "/api/quiet-periods"), ("POST", "/api/what-if"),
                ("POST", "/api/alerts/no-such-id/ack"), ("DELETE", "/api/quiet-periods/999999")]


def spellings(port):
    """The spellings of src/test/java/org/slopewatch/security/PathSpellings.java, by the same names."""
    def first(p):
        return p[1:].split("/", 1)[0]

    def rest(p):
        return p[1:].split("/", 1)[1]

    return [
        ("canonical", lambda p: p),
        ("matrix on the first segment", lambda p: "/" + first(p) + ";x/" + rest(p)),
        ("matrix on the last segment", lambda p: p + ";x"),
        ("empty matrix on the first segment", lambda p: "/" + first(p) + ";/" + rest(p)),
        ("escaped semicolon", lambda p: "/" + first(p) + "%3Bx/" + rest(p)),
        ("leading double slash", lambda p: "/" + p),
        ("inner double slash", lambda p: "/" + first(p) + "//" + rest(p)),
        ("escaped first letter", lambda p: "/%%%02X" % ord(first(p)[0]) + first(p)[1:] + "/" + rest(p)),
        ("escaped slash", lambda p: "/" + first(p) + "%2F" + rest(p)),
        ("escaped letter of the second segment", lambda p: "/" + first(p) + "/%%%02X" % ord(rest(p)[0]) + rest(p)[1:]),
        ("climb out of the health path", lambda p: "/q/health/../.." + p),
        ("climb out of a made-up segment", lambda p: "/x/.." + p),
        ("dot segment", lambda p: "/" + first(p) + "/./" + rest(p)),
        ("leading dot segment", lambda p: "/." + p),
        ("escaped dot segments", lambda p: "/q/health/%2e%2e/%2E%2E" + p),
        ("dot segments with empty matrix", lambda p: "/q/health/..;/..;" + p),
        ("upper case", lambda p: p.upper()),
        ("capitalised segments", lambda p: "/" + "/".join(x[:1].upper() + x[1:] for x in p[1:].split("/"))),
        ("trailing slash", lambda p: p + "/"),
        ("backslash", lambda p: "/" + first(p) + "\\" + rest(p)),
        ("climb out of the dashboard page", lambda p: "/index.html/.." + p),
        ("climb out of a dashboard file with a matrix", lambda p: "/dashboard.js;/.." + p),
        ("climb out of a dashboard file with an escaped dot segment", lambda p: "/dashboard.js/%2e%2e" + p),
        ("absolute form", lambda p: "http://127.0.0.1:%d%s" % (port, p)),
        ("absolute form with a matrix", lambda p: "http://127.0.0.1:%d/%s;x/%s" % (port, first(p), rest(p))),
        ("fragment", lambda p: p + "#x"),
    ]


def raw(base, method, target, token=None, body=None):
    """One request with the target sent byte for byte (urllib would normalise it); returns (status, text)."""
    u = urllib.parse.urlsplit(base)
    conn = http.client.HTTPConnection(u.hostname, u.port or 80, timeout=60)
    try:
        conn.putrequest(method, target, skip_host=True, skip_accept_encoding=True)
        conn.putheader("Host", "%s:%d" % (u.hostname, u.port or 80))
        if token:
            conn.putheader("Authorization", "Bearer " + token)
        if body is not None:
            conn.putheader("Content-Type", "application/json")
            conn.putheader("Content-Length", str(len(body)))
        conn.endheaders(body)
        r = conn.getresponse()
        return r.status, r.read().decode("utf-8", "replace")
    finally:
        conn.close()


def paths(base, token):
    """Every route under every spelling without a token: 400, 401 or 404, never an answer; with the
    token the canonical reads answer and a matrix parameter is 400. With open reads (the demo) a
    read by its canonical path, or in absolute form, answers without a token, as it should."""
    port = urllib.parse.urlsplit(base).port or 80
    open_reads = raw(base, "GET", "/api/spreads")[0] == 200
    failures = 0
    sent = 0
    started = time.monotonic()
    targets = [("GET", p, q) for p, q in READ_ROUTES] + [(m, p, "") for m, p in WRITE_ROUTES]
    for method, path, query in targets:
        for name, spell in spellings(port):
            if open_reads and method == "GET" and (path.startswith("/api/") or path == "/q/openapi") and name in ("canonical", "absolute form"):
                continue
            code, text = raw(base, method, spell(path) + query, None, None if method == "GET" else b"{}")
            sent += 1
            if code not in (400, 401, 404):
                failures += 1
                print("FAIL no token, %-55s %s %s -> HTTP %d %s" % (name, method, spell(path) + query, code, text[:120].replace("\n", " ")))
    print("%-4s paths: %d requests without a token (%d routes, %d spellings%s), %d answered; %.2f s" % (
        "ok" if failures == 0 else "FAIL", sent, len(targets), len(spellings(port)), ", open reads" if open_reads else "",
        failures, time.monotonic() - started))
    if token:
        wrong = 0
        for path, query in READ_ROUTES:
            code, _ = raw(base, "GET", path + query, token)
            matrix, _ = raw(base, "GET", path + ";x" + query, token)
            ok = code in (200, 404) and matrix == 400
            wrong += 0 if ok else 1
            if not ok:
                print("FAIL with the token: GET %s -> HTTP %d, GET %s;x -> HTTP %d (expected 200 and 400)" % (path + query, code, path, matrix))
        print("%-4s paths with the token: %d reads by their canonical path, each with a matrix parameter too; %d answered otherwise" % (
            "ok" if wrong == 0 else "FAIL", len(READ_ROUTES), wrong))
        failures += wrong
    return failures


def main():
    p = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    p.add_argument("url", nargs="?", default="http://localhost:8080", help="the daemon (default http://localhost:8080)")
    p.add_argument("token", nargs="?", default=None, help="a write token (default: $SLOPEWATCH_TOKEN)")
    p.add_argument("--policy-file", help="the daemon's policy file: try hostile policies through the live reload, then restore it")
    p.add_argument("--launcher", default=str(ROOT / "slopewatch"), help="the launcher for vet-policy (default ./slopewatch)")
    a = p.parse_args()
    import os
    token = a.token or os.environ.get("SLOPEWATCH_TOKEN")
    base = a.url.rstrip("/")
    failures = paths(base, token) + quotes(base, token) + policies(a.launcher) + whatif(base, token) + alerting(base, token)
    if a.policy_file:
        failures += reload(base, token, a.policy_file)
    code, _, _ = request(base + "/q/health/ready", None)
    good = json.dumps({"curve": "GOVT-A", "tenor": "10Y", "date": time.strftime("%Y-%m-%d"), "yield": 4.215}).encode()
    status, text, _ = request(base + "/api/quotes", token, "POST", good, "application/json")
    print("%-4s after it all: /q/health/ready HTTP %d, a good quote HTTP %d %s" % (
        "ok" if code == 200 and status == 200 else "FAIL", code, status, text[:100]))
    failures += 0 if code == 200 and status == 200 else 1
    print("FAILED: %d" % failures if failures else "all answered as expected")
    sys.exit(1 if failures else 0)


if __name__ == "__main__":
    main()
