"""The quickstart's work as a PyTorch + scikit-learn user would write it: the peer of `crosswise bench`.

Reads the experience `crosswise bench` exported (.npy, the same steps and episode split
crosswise uses) and runs the fixed quickstart's 15 cells (5 learners x 3 seeds) in worker
processes of one thread each: an encoder [128, 64] relu trained 10 epochs with Adam
(lr 1e-3, batch 256, early stopping on the validation loss, patience 3), then L2 logistic
(categorical targets) and ridge (continuous ones) read-outs, the penalty chosen on the
validation split from 8 values, scored on test features with sight under Gaussian noise
at severities 0-5 (sigma 0, 0.25, 0.5, 1, 2, 4 training standard deviations).
Prints one JSON object with the cell count and the seconds spent training and probing.
"""
import json
import os
import sys
import time
import warnings
from multiprocessing import get_context

import numpy as np

LEARNERS = {
    # name: (input channels, target channels, how the target is formed)
    "sound-from-sight": (["sight"], ["sound"], "same-step"),
    "touch-from-sight-and-motor": (["sight", "motor"], ["touch"], "same-step"),
    "sight-autoencoder": (["sight"], ["sight"], "same-step"),
    "sight-forecaster": (["sight"], ["sight"], "next-step"),
    "untrained": (["sight"], [], "none"),
}
SIGMAS = [0.0, 0.25, 0.5, 1.0, 2.0, 4.0]
PENALTIES = np.logspace(-4, 3, 8)


def one_thread() -> None:
    import torch
    torch.set_num_threads(1)
    warnings.filterwarnings("ignore")  # lbfgs reaching its default 100 iterations at weak penalties


def load(folder: str, seed: int) -> dict:
    path = os.path.join(folder, f"seed-{seed}")
    return {name[:-4]: np.load(os.path.join(path, name)) for name in os.listdir(path)}


def standardiser(x: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    std = x.std(axis=0)
    return x.mean(axis=0), np.where(std < 1e-6, 1.0, std)


def train_encoder(x, y, extra, x_val, y_val, extra_val, seed: int):
    import torch
    torch.manual_seed(seed)
    encoder = torch.nn.Sequential(torch.nn.Linear(x.shape[1], 128), torch.nn.ReLU(), torch.nn.Linear(128, 64), torch.nn.ReLU())
    head = torch.nn.Linear(64 + (0 if extra is None else extra.shape[1]), y.shape[1])
    params = list(encoder.parameters()) + list(head.parameters())
    optimizer = torch.optim.Adam(params, lr=1e-3)
    tensors = [torch.from_numpy(a) for a in (x, y, x_val, y_val)]
    extras = [None if e is None else torch.from_numpy(e) for e in (extra, extra_val)]

    def predict(inputs, more):
        h = encoder(inputs)
        return head(h if more is None else torch.cat([h, more], 1))

    best, best_loss, since = None, float("inf"), 0
    for _ in range(10):
        order = torch.randperm(len(x))
        for i in range(0, len(x), 256):
            rows = order[i:i + 256]
            optimizer.zero_grad()
            loss = torch.nn.functional.mse_loss(predict(tensors[0][rows], None if extras[0] is None else extras[0][rows]), tensors[1][rows])
            loss.backward()
            optimizer.step()
        with torch.no_grad():
            val = torch.nn.functional.mse_loss(predict(tensors[2], extras[1]), tensors[3]).item()
        if val < best_loss:
            best, best_loss, since = [p.detach().clone() for p in params], val, 0
        else:
            since += 1
            if since >= 3:
                break
    with torch.no_grad():
        for p, b in zip(params, best):
            p.copy_(b)
    return encoder


def run_cell(job: tuple[str, int, str]) -> dict:
    import torch
    from sklearn.linear_model import LogisticRegression, Ridge
    from sklearn.preprocessing import StandardScaler

    name, seed, folder = job
    kinds = json.load(open(os.path.join(folder, "targets.json")))["targets"]
    data = load(folder, seed)
    split = {s: data[f"split_{s}"].astype(np.int64) for s in ("train", "validation", "test")}
    inputs, targets, form = LEARNERS[name]
    mean, std = standardiser(np.concatenate([data[c] for c in inputs], 1)[split["train"]])
    x_all = (np.concatenate([data[c] for c in inputs], 1) - mean) / std
    started = time.perf_counter()
    if form == "none":
        torch.manual_seed(seed)
        encoder = torch.nn.Sequential(torch.nn.Linear(x_all.shape[1], 128), torch.nn.ReLU(), torch.nn.Linear(128, 64), torch.nn.ReLU())
    else:
        def examples(steps):
            if form == "next-step":
                steps = steps[data["has_next"][steps] == 1]
                nxt = steps + 1
                return x_all[steps], x_all[nxt], data["motor"][nxt]
            y = np.concatenate([data[c] for c in targets], 1)
            y_mean, y_std = standardiser(y[split["train"]])
            return x_all[steps], (y[steps] - y_mean) / y_std, None
        x, y, extra = examples(split["train"])
        x_val, y_val, extra_val = examples(split["validation"])
        encoder = train_encoder(x, y.astype(np.float32), extra, x_val, y_val.astype(np.float32), extra_val, seed)
    train_s = time.perf_counter() - started

    started = time.perf_counter()
    rng = np.random.default_rng(seed)
    sight_cols = data["sight"].shape[1]

    def features(rows: np.ndarray) -> np.ndarray:
        with torch.no_grad():
            return encoder(torch.from_numpy(rows.astype(np.float32))).numpy()

    f_train, f_val = features(x_all[split["train"]]), features(x_all[split["validation"]])
    noisy = []
    for sigma in SIGMAS:
        x_test = x_all[split["test"]].copy()
        x_test[:, :sight_cols] += sigma * rng.standard_normal((len(x_test), sight_cols))  # sigma in training stds
        noisy.append(features(x_test))
    scaler = StandardScaler().fit(f_train)
    f_train, f_val, noisy = scaler.transform(f_train), scaler.transform(f_val), [scaler.transform(f) for f in noisy]
    scores = {}
    for target, kind in kinds.items():
        y = data[target]
        y_train, y_val, y_test = y[split["train"]], y[split["validation"]], y[split["test"]]
        fits = []
        for alpha in PENALTIES:
            model = LogisticRegression(C=1 / alpha) if kind == "categorical" else Ridge(alpha=alpha)  # scikit-learn's defaults
            model.fit(f_train, y_train)
            fits.append((model.score(f_val, y_val), model))
        best = max(fits, key=lambda fit: fit[0])[1]
        scores[target] = [best.score(f, y_test) for f in noisy]
    return {"cell": f"{name}/{seed}", "train_s": train_s, "probe_s": time.perf_counter() - started, "scores": scores}


def main() -> None:
    folder = sys.argv[1]
    workers = int(sys.argv[sys.argv.index("--workers") + 1]) if "--workers" in sys.argv else 2
    seeds = json.load(open(os.path.join(folder, "targets.json")))["seeds"]
    jobs = [(name, seed, folder) for name in LEARNERS for seed in seeds]
    with get_context("fork").Pool(workers, initializer=one_thread) as pool:
        cells = pool.map(run_cell, jobs, chunksize=1)
    print(json.dumps({"cells": len(cells), "train_s": sum(c["train_s"] for c in cells), "probe_s": sum(c["probe_s"] for c in cells)}))


if __name__ == "__main__":
    main()
