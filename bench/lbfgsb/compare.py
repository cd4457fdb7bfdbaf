"""Evaluations that scipy's L-BFGS-B needs on the molecule-like models.

Runs scipy.optimize.minimize(method="L-BFGS-B") (the Byrd-Lu-Nocedal-Zhu
algorithm, L-BFGS-B 3.0, as shipped in scipy) on the very energies strainwise
evaluates: each model of bench/molecule-like.js is served by
bench/lbfgsb/server.js over a pipe. The criterion is strainwise's: stop at the
first iterate whose largest per-atom gradient norm is <= MAX_FORCE (scipy's own
tests are switched off with gtol = ftol = 0 and the run is stopped from the
callback). Every energy+gradient call is counted.

Writes test/optimize/lbfgsb-reference.json, which the test suite reads. Run
after `npm run build`:  python3 bench/lbfgsb/compare.py
"""
import json, os, struct, subprocess, sys
import numpy as np
import scipy
from scipy.optimize import minimize

HERE = os.path.dirname(os.path.abspath(__file__))
ROOT = os.path.dirname(os.path.dirname(HERE))
MAX_FORCE = 1e-3
MODELS = [(c, s) for c in (8, 10, 12, 14, 16) for s in (1, 2, 3)]


def run(carbons, seed):
    proc = subprocess.Popen(["node", os.path.join(HERE, "server.js"), str(carbons), str(seed)],
                            stdin=subprocess.PIPE, stdout=subprocess.PIPE)
    x0 = np.array(json.loads(proc.stdout.readline()))
    n = x0.size
    count = {"evals": 0}
    last = {}

    def fun(x):
        count["evals"] += 1
        proc.stdin.write(np.asarray(x, dtype="<f8").tobytes())
        proc.stdin.flush()
        buf = proc.stdout.read(8 * (n + 1))
        v = np.frombuffer(buf, dtype="<f8")
        last["x"] = np.array(x)
        last["g"] = v[1:].copy()
        last["f"] = v[0]
        return v[0], v[1:].copy()

    done = {"converged": False}

    def callback(intermediate_result):
        x = intermediate_result.x
        if "x" in last and np.array_equal(last["x"], x):
            g = last["g"]
        else:
            _, g = fun(x)
        if np.max(np.linalg.norm(g.reshape(-1, 3), axis=1)) <= MAX_FORCE:
            done["converged"] = True
            raise StopIteration

    res = minimize(fun, x0, jac=True, method="L-BFGS-B", callback=callback,
                   options={"maxcor": 10, "gtol": 0.0, "ftol": 0.0, "maxiter": 100000, "maxfun": 100000})
    proc.stdin.close()
    proc.wait()
    return {"carbons": carbons, "seed": seed, "atoms": n // 3, "converged": done["converged"],
            "evaluations": count["evals"], "iterations": int(res.nit), "energy": float(last["f"]),
            "message": str(res.message)}


def main():
    rows = []
    for carbons, seed in MODELS:
        r = run(carbons, seed)
        rows.append(r)
        print(f"{carbons:3d} carbons seed {seed}: {r['atoms']} atoms, {r['evaluations']} evaluations,"
              f" converged {r['converged']} ({r['message']})", file=sys.stderr)
    out = {
        "source": f"scipy {scipy.__version__} optimize.minimize(method='L-BFGS-B'), numpy {np.__version__}",
        "options": {"maxcor": 10, "gtol": 0, "ftol": 0, "stop": f"largest per-atom gradient norm <= {MAX_FORCE} at an iterate (callback)"},
        "generator": "bench/molecule-like.js moleculeLikeModel({carbons, seed})",
        "maxForce": MAX_FORCE,
        "models": rows,
    }
    with open(os.path.join(ROOT, "test", "optimize", "lbfgsb-reference.json"), "w") as f:
        json.dump(out, f, indent=2)
        f.write("\n")


if __name__ == "__main__":
    main()
