#!/usr/bin/env python3
"""Checks the YAML under deploy/ with a real parser, and what the manifests promise each other.

    python3 deploy/check-yaml.py          (needs PyYAML: Debian's python3-yaml)

- every *.yml / *.yaml under deploy/ parses (all documents of a multi-document file);
- the copies that kustomize needs inside deploy/kubernetes are identical to their originals
  (alert-rules/default.yaml, deploy/config/application.properties);
- the Kubernetes manifests agree: the resources and generator files the kustomization names
  exist; every Secret key the Deployment reads is in secret.example.yaml; every ConfigMap it
  uses is generated; the policy path it sets lies in the mounted policy ConfigMap under the
  generated key; probes, replicas and the security context are the ones deploy/README.md
  describes;
- the Prometheus files name the rule file that exists, and the scrape job is "slopewatch".

Prints one line per check and "N passed, M failed"; exits 1 when anything failed.
"""
import pathlib
import sys

import yaml

DEPLOY = pathlib.Path(__file__).resolve().parent
ROOT = DEPLOY.parent
K8S = DEPLOY / "kubernetes"

passed = 0
failed = 0


def check(ok, what):
    global passed, failed
    if ok:
        passed += 1
        print(f"  ok    {what}")
    else:
        failed += 1
        print(f"  FAIL  {what}")
    return ok


def load_all(path):
    with open(path, encoding="utf-8") as f:
        return [d for d in yaml.safe_load_all(f) if d is not None]


# --- every YAML file parses ---
docs_by_file = {}
for path in sorted(list(DEPLOY.rglob("*.yml")) + list(DEPLOY.rglob("*.yaml"))):
    rel = path.relative_to(ROOT)
    try:
        docs = load_all(path)
        docs_by_file[path] = docs
        check(len(docs) > 0, f"{rel} parses ({len(docs)} document(s))")
    except yaml.YAMLError as e:
        check(False, f"{rel} parses: {e}")

# --- copies kustomize needs ---
for copy, original in [(K8S / "files" / "default.yaml", ROOT / "alert-rules" / "default.yaml"),
                       (K8S / "files" / "application.properties", DEPLOY / "config" / "application.properties")]:
    same = copy.exists() and original.exists() and copy.read_bytes() == original.read_bytes()
    check(same, f"{copy.relative_to(ROOT)} is identical to {original.relative_to(ROOT)}"
          + ("" if same else f" (copy it again: cp {original.relative_to(ROOT)} {copy.relative_to(ROOT)})"))

# --- Kubernetes ---
kust = docs_by_file.get(K8S / "kustomization.yaml", [{}])[0]
resources = {}
for name in kust.get("resources", []):
    path = K8S / name
    if check(path.exists(), f"kustomization resource {name} exists"):
        for doc in docs_by_file.get(path, []):
            check(all(k in doc for k in ("apiVersion", "kind", "metadata")) and "name" in doc["metadata"],
                  f"{name}: {doc.get('kind')} has apiVersion, kind and metadata.name")
            resources[doc["kind"]] = doc
check("secret.example.yaml" not in kust.get("resources", []),
      "the Secret template is not applied by the kustomization")

generated = {}
for gen in kust.get("configMapGenerator", []):
    keys = {}
    for entry in gen.get("files", []):
        key, _, file = entry.partition("=")
        file = file or key
        check((K8S / file).exists(), f"configMap {gen['name']}: file {file} exists")
        keys[pathlib.Path(key).name] = K8S / file
    for literal in gen.get("literals", []):
        key, _, _ = literal.partition("=")
        keys[key] = None
    generated[gen["name"]] = (keys, gen.get("options", {}))

secret = docs_by_file.get(K8S / "secret.example.yaml", [{}])[0]
secret_keys = set(secret.get("stringData", {}))
check(secret.get("kind") == "Secret" and all(v.startswith("<") for v in secret.get("stringData", {}).values()),
      "secret.example.yaml holds placeholders only")

dep = resources.get("Deployment", {})
spec = dep.get("spec", {})
pod = spec.get("template", {}).get("spec", {})
containers = pod.get("containers", [])
check(len(containers) == 1, "the Deployment has one container")
c = containers[0] if containers else {}
env = {e["name"]: e for e in c.get("env", [])}

check(spec.get("replicas") == 2, "two replicas")
check(c.get("args", [])[:2] == ["serve", "--kafka"], "the container runs 'serve --kafka'")
probes = {p: c.get(p, {}).get("httpGet", {}).get("path") for p in ("livenessProbe", "readinessProbe", "startupProbe")}
check(probes["livenessProbe"] == "/q/health/live", "liveness probe on /q/health/live")
check(probes["readinessProbe"] == "/q/health/ready", "readiness probe on /q/health/ready")
check(probes["startupProbe"] == "/q/health/started", "startup probe on /q/health/started")
startup = c.get("startupProbe", {})
check(startup.get("periodSeconds", 10) * startup.get("failureThreshold", 3) >= 300,
      "the startup probe allows at least 5 minutes for journal recovery")
check(pod.get("securityContext", {}).get("runAsNonRoot") is True, "runAsNonRoot")
check(c.get("securityContext", {}).get("readOnlyRootFilesystem") is True, "readOnlyRootFilesystem")
check(c.get("securityContext", {}).get("capabilities", {}).get("drop") == ["ALL"], "all capabilities dropped")
limits = c.get("resources", {})
check("requests" in limits and "memory" in limits.get("limits", {}), "resource requests and a memory limit")

volumes = {v["name"]: v for v in pod.get("volumes", [])}
mounts = {m["mountPath"]: m for m in c.get("volumeMounts", [])}
tmp = mounts.get("/tmp")
check(tmp is not None and "emptyDir" in volumes.get(tmp["name"], {}), "/tmp is an emptyDir")

for name, e in env.items():
    ref = e.get("valueFrom", {}).get("secretKeyRef")
    if ref:
        check(ref["name"] == secret.get("metadata", {}).get("name") and ref["key"] in secret_keys,
              f"env {name}: Secret key {ref['key']} is in the template")
for token in ("SLOPEWATCH_SECURITY_WRITE_TOKENS", "SLOPEWATCH_SECURITY_READ_TOKENS"):
    check(token in env, f"env {token} is passed to the container")
for ref in c.get("envFrom", []):
    name = ref.get("configMapRef", {}).get("name")
    check(name in generated, f"envFrom ConfigMap {name} is generated")
for v in volumes.values():
    if "configMap" in v:
        check(v["configMap"]["name"] in generated, f"volume {v['name']}: ConfigMap {v['configMap']['name']} is generated")


def mounted_file(path):
    """The generated file a path inside a ConfigMap volume mount resolves to, or None."""
    for mount_path, m in mounts.items():
        prefix = mount_path.rstrip("/") + "/"
        if path.startswith(prefix) and "subPath" not in m:
            cm = volumes.get(m["name"], {}).get("configMap", {}).get("name")
            keys, options = generated.get(cm, ({}, {}))
            return keys.get(path[len(prefix):]), cm, options
    return None, None, {}


policy_path = env.get("SLOPEWATCH_INGEST_POLICY", {}).get("value", "")
policy_file, policy_cm, policy_options = mounted_file(policy_path)
check(policy_file is not None and policy_file.name == "default.yaml",
      f"SLOPEWATCH_INGEST_POLICY={policy_path} is the policy file of a mounted ConfigMap")
check(policy_options.get("disableNameSuffixHash") is True,
      f"the policy ConfigMap {policy_cm} keeps its name, so that edits reach the pods for hot reload")
config_path = env.get("QUARKUS_CONFIG_LOCATIONS", {}).get("value", "")
config_file, _, _ = mounted_file(config_path)
check(config_file is not None and config_file.name == "application.properties",
      f"QUARKUS_CONFIG_LOCATIONS={config_path} is a file of a mounted ConfigMap")

svc = resources.get("Service", {})
check(any(p.get("targetPort") == "http" for p in svc.get("spec", {}).get("ports", []))
      and any(p.get("name") == "http" for p in c.get("ports", [])),
      "the Service targets the container port named http")
check(svc.get("spec", {}).get("selector", {}).items() <= spec.get("template", {}).get("metadata", {}).get("labels", {}).items(),
      "the Service selects the Deployment's pods")

# --- Prometheus ---
for name in ("prometheus.yml", "prometheus-kubernetes.yml"):
    cfg = docs_by_file.get(DEPLOY / "prometheus" / name, [{}])[0]
    jobs = [j.get("job_name") for j in cfg.get("scrape_configs", [])]
    check(jobs == ["slopewatch"] and all(j.get("metrics_path") == "/q/metrics" for j in cfg.get("scrape_configs", [])),
          f"prometheus/{name}: job slopewatch scrapes /q/metrics")
    check(all((DEPLOY / "prometheus" / r).exists() for r in cfg.get("rule_files", [])) and cfg.get("rule_files"),
          f"prometheus/{name}: its rule files exist")

print(f"{passed} passed, {failed} failed")
sys.exit(1 if failed else 0)
