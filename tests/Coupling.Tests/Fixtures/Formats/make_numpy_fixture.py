"""Writes .npy fixtures with Debian's numpy and a JSON file listing each array's shape and values in C order."""
import json
import sys

import numpy as np

out = sys.argv[1] if len(sys.argv) > 1 else "."
base = np.arange(24, dtype=np.float64).reshape(2, 3, 4) * 1.5 - 7.25
cases = {
    "f8_c": base.astype("<f8"),
    "f8_fortran": np.asfortranarray(base.astype("<f8")),
    "f4_c": (base / 3.0).astype("<f4"),
    "f4_fortran": np.asfortranarray((base / 3.0).astype("<f4")),
    "i2_c": (base * 4).astype("<i2"),
    "i4_fortran": np.asfortranarray((base * 1000).astype("<i4")),
    "i8_c": (base * 100000).astype("<i8").reshape(4, 6),
    "f8_1d": np.linspace(-1.0, 1.0, 7).astype("<f8"),
}
expected = {}
for name, arr in cases.items():
    np.save(f"{out}/npy_{name}.npy", arr)
    expected[name] = {
        "descr": arr.dtype.str,
        "fortran_order": bool(np.isfortran(arr)) and arr.ndim > 1,
        "shape": list(arr.shape),
        "values": [float(v) for v in np.ascontiguousarray(arr).ravel(order="C")],
    }
# version 2.0 header, written explicitly
with open(f"{out}/npy_f8_v2.npy", "wb") as f:
    np.lib.format.write_array(f, base, version=(2, 0))
expected["f8_v2"] = {"descr": "<f8", "fortran_order": False, "shape": list(base.shape),
                     "values": [float(v) for v in base.ravel(order="C")]}
expected["numpy_version"] = np.__version__
with open(f"{out}/npy_expected.json", "w") as f:
    json.dump(expected, f, indent=1)
