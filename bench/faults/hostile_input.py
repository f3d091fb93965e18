#!/usr/bin/env python3
"""The long form of HostileInputTest: the bad-input corpus against a daemon that is already running.

Posts every quote file of bench/faults/corpus/quotes (in the table's order, with the content type the
table gives) to POST /api/quotes, checks each answer against expected-quotes.tsv (status, accepted,
duplicates, reasons, first detail), checks
after every file that the daemon still answers /q/health/live, then sends the oversized requests
(a body past the 16M limit, a batch of 20,001 quotes), runs `./slopewatch check-rules` on the policy
corpus against expected-policies.tsv and, with --policy-file, tries a few hostile policies through
the live reload and puts the file back. Prints one line per input and a summary with timings; exits
1 when an answer differs from its expectation. Standard library only (python3).

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
                "p30-nul-escape-in-message.yaml", "p37-webhook-url-in-policy.yaml"]


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
    run = subprocess.run([launcher, "check-rules", str(CORPUS / "policies")], capture_output=True, text=True, cwd=ROOT)
    seconds = time.monotonic() - started
    failures = 0 if run.returncode == 2 else 1
    for f, category, outcome, position, message in rows:
        path = str(CORPUS / f)
        ok = (path + ": ok: ") in run.stdout if outcome == "accepted" else \
            any(line.startswith(path + ":" + position + ": ") and message in line for line in run.stderr.splitlines())
        failures += 0 if ok else 1
        print("%-4s %-50s %-13s %s" % ("ok" if ok else "FAIL", f, category, "accepted" if outcome == "accepted" else position + " " + message))
    print("policies: %d files through check-rules in %.2f s (exit code %d, expected 2), %d answered otherwise than expected" % (
        len(rows), seconds, run.returncode, failures))
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


def main():
    p = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    p.add_argument("url", nargs="?", default="http://localhost:8080", help="the daemon (default http://localhost:8080)")
    p.add_argument("token", nargs="?", default=None, help="a write token (default: $SLOPEWATCH_TOKEN)")
    p.add_argument("--policy-file", help="the daemon's policy file: try hostile policies through the live reload, then restore it")
    p.add_argument("--launcher", default=str(ROOT / "slopewatch"), help="the launcher for check-rules (default ./slopewatch)")
    a = p.parse_args()
    import os
    token = a.token or os.environ.get("SLOPEWATCH_TOKEN")
    base = a.url.rstrip("/")
    failures = quotes(base, token) + policies(a.launcher)
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
