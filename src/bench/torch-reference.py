"""The reference training workload of `crosswise bench`, in PyTorch on one CPU thread.

Same shape as the TensorFlow.js reference: an MLP 160 -> 128 -> 128 -> 48 with ReLU,
mean squared error, Adam (lr 1e-3), batch 256, on Gaussian inputs and targets. One epoch
warms up, then each of `repeats` epochs is timed. Prints one JSON object:
{"samples_per_s": [...], "torch": version, "threads": n, "blas": kind, "blas_library": path}.
Run only when `import torch` works; crosswise never installs PyTorch.
"""
import json
import os
import re
import sys
import time

import torch

ROWS = 10240


def blas_in_use() -> tuple[str, str]:
    """The BLAS this process has mapped, read from /proc/self/maps: (kind, library path)."""
    libraries = []
    with open("/proc/self/maps", encoding="utf8") as maps:
        for line in maps:
            path = line.split()[-1]
            if re.search(r"blas|mkl|blis|atlas", os.path.basename(path)) and path not in libraries:
                libraries.append(path)
    for kind, pattern in (("openblas", "openblas"), ("mkl", "mkl"), ("blis", "blis"), ("atlas", "atlas")):
        for path in libraries:
            if pattern in path:
                return kind, path
    for path in libraries:
        if os.path.basename(path).startswith("libblas"):
            return "reference", os.path.realpath(path)
    return "unknown", ""


def epoch_rates(rows: int, repeats: int) -> list[float]:
    generator = torch.Generator().manual_seed(1)
    x = torch.randn(rows, 160, generator=generator)
    y = torch.randn(rows, 48, generator=generator)
    model = torch.nn.Sequential(
        torch.nn.Linear(160, 128), torch.nn.ReLU(),
        torch.nn.Linear(128, 128), torch.nn.ReLU(),
        torch.nn.Linear(128, 48),
    )
    optimizer = torch.optim.Adam(model.parameters(), lr=1e-3)
    rates = []
    for _ in range(repeats + 1):  # the first epoch warms up and is dropped
        start = time.perf_counter()
        for i in range(0, rows, 256):
            optimizer.zero_grad()
            loss = torch.nn.functional.mse_loss(model(x[i:i + 256]), y[i:i + 256])
            loss.backward()
            optimizer.step()
        rates.append(rows / (time.perf_counter() - start))
    return rates[1:]


def main() -> None:
    repeats = int(sys.argv[1]) if len(sys.argv) > 1 else 3
    rows = int(sys.argv[2]) if len(sys.argv) > 2 else ROWS
    torch.set_num_threads(1)
    rates = epoch_rates(rows, repeats)
    kind, library = blas_in_use()
    print(json.dumps({"samples_per_s": rates, "torch": torch.__version__, "threads": torch.get_num_threads(),
                      "blas": kind, "blas_library": library}))


if __name__ == "__main__":
    main()
