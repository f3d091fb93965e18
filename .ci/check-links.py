#!/usr/bin/env python3
"""Checks that every relative Markdown link in the given files points at an existing file and,
for an anchor, at a heading whose GitHub-style slug matches.

Usage: python3 .ci/check-links.py $(git ls-files '*.md')   (exit 1 when a link is broken)
Not part of .ci/run; external links (http:, mailto:, ...) are not checked."""
import re, sys, os

LINK = re.compile(r'(?<!!)\[[^\]]*\]\(([^)\s]+)\)')

def slugs(path):
    out, seen, fence = set(), {}, False
    for line in open(path, encoding='utf-8'):
        if line.lstrip().startswith('```'):
            fence = not fence
        if fence:
            continue
        m = re.match(r'#{1,6}\s+(.*?)\s*#*\s*$', line)
        if not m:
            continue
        s = m.group(1).strip().lower()
        s = re.sub(r'[^\w\- ]', '', s)  # keep letters, digits, _, -, space (GitHub's rule)
        s = s.replace(' ', '-')
        n = seen.get(s, 0); seen[s] = n + 1
        out.add(s if n == 0 else f'{s}-{n}')
    return out

def links(path):
    kept, fence = [], False
    for line in open(path, encoding='utf-8'):
        if line.lstrip().startswith('```'):
            fence = not fence
            kept.append('\n'); continue
        kept.append('\n' if fence else re.sub(r'`[^`\n]*`', '', line))
    text = ''.join(kept)
    for m in LINK.finditer(text):  # link text may run over a line break
        yield text.count('\n', 0, m.start()) + 1, m.group(1)

bad = 0; count = 0
for f in sys.argv[1:]:
    for no, target in links(f):
        if re.match(r'[a-z]+:', target):
            continue
        count += 1
        file, _, anchor = target.partition('#')
        dest = os.path.normpath(os.path.join(os.path.dirname(f), file)) if file else f
        if not os.path.exists(dest):
            print(f'{f}:{no}: missing file {target}'); bad += 1; continue
        if anchor and dest.endswith('.md') and anchor not in slugs(dest):
            print(f'{f}:{no}: no heading for #{anchor} in {dest}'); bad += 1
print(f'{count} relative links checked, {bad} broken')
sys.exit(1 if bad else 0)
