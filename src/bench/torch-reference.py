"""The reference training workload of `crosswise bench`, in PyTorch on one CPU thread.

Same shape as the TensorFlow.js reference: an MLP 160 -> 128 -> 128 -> 48 with ReLU,
mean squared error, Adam (lr 1e-3), batch 256, on Gaussian inputs and targets.
Prints one JSON object: {"samples_per_s": ..., "torch": version, "rounds": n}.
Run only when `import torch` works; crosswise never installs PyTorch.
"""
import json
import statistics
import sys
import time

import torch


def samples_per_second(rows: int, epochs: int) -> float:
    generator = torch.Generator().manual_seed(1)
    x = torch.randn(rows, 160, generator=generator)
    y = torch.randn(rows, 48, generator=generator)
    model = torch.nn.Sequential(
        torch.nn.Linear(160, 128), torch.nn.ReLU(),
        torch.nn.Linear(128, 128), torch.nn.ReLU(),
        torch.nn.Linear(128, 48),
    )
    optimizer = torch.optim.Adam(model.parameters(), lr=1e-3)
    seconds = []
    for _ in range(epochs + 1):  # the first epoch warms up and is not timed
        start = time.perf_counter()
        for i in range(0, rows, 256):
            optimizer.zero_grad()
            loss = torch.nn.functional.mse_loss(model(x[i:i + 256]), y[i:i + 256])
            loss.backward()
            optimizer.step()
        seconds.append(time.perf_counter() - start)
    return rows * epochs / sum(seconds[1:])


def main() -> None:
    quick = "--quick" in sys.argv
    torch.set_num_threads(1)
    rounds = 1 if quick else 3
    rates = [samples_per_second(2560 if quick else 10240, 2 if quick else 3) for _ in range(rounds)]
    print(json.dumps({"samples_per_s": statistics.median(rates), "torch": torch.__version__, "rounds": rounds}))


if __name__ == "__main__":
    main()
