# Writes the .npy and .mat fixtures of viewgain's array loader tests with numpy and scipy (independent writers).
# Run from this folder: python3 generate.py   (numpy 2.4.6, scipy 1.17.1; see README.md for what each file holds)
import os
import numpy as np
import numpy.lib.format as fmt
import scipy.io

SUBJECTS = ["s1", "s2", "s3"]
R = 4


def matrix(s):
    """Subject s (1-based): m[i][j] = s + (i+1)*(j+1)/8 off the diagonal, 0 on it (exact in float32 too)."""
    m = np.array([[s + (i + 1) * (j + 1) / 8.0 for j in range(R)] for i in range(R)])
    np.fill_diagonal(m, 0.0)
    return m


def int_matrix(s):
    """Subject s: m[i][j] = 10*s + (i+1)*(j+1) off the diagonal, 0 on it."""
    m = np.array([[10 * s + (i + 1) * (j + 1) for j in range(R)] for i in range(R)])
    np.fill_diagonal(m, 0)
    return m


def write_npy(path, a, version):
    with open(path, "wb") as f:
        fmt.write_array(f, a, version=version)


def per_subject(folder, make, version):
    os.makedirs(folder, exist_ok=True)
    for k, s in enumerate(SUBJECTS, start=1):
        write_npy(os.path.join(folder, s + ".npy"), make(k), version)


per_subject("npy-f8-le-c-v1", lambda k: matrix(k).astype("<f8"), (1, 0))
per_subject("npy-f8-be-fortran-v2", lambda k: np.asfortranarray(matrix(k).astype(">f8")), (2, 0))
per_subject("npy-f4-le-c-v3", lambda k: matrix(k).astype("<f4"), (3, 0))
per_subject("npy-i4-be-c-v1", lambda k: int_matrix(k).astype(">i4"), (1, 0))
per_subject("npy-i8-le-fortran-v1", lambda k: np.asfortranarray(int_matrix(k).astype("<i8")), (1, 0))

os.makedirs("mat-v5", exist_ok=True)
os.makedirs("mat-v5-compressed", exist_ok=True)
for k, s in enumerate(SUBJECTS, start=1):
    scipy.io.savemat(os.path.join("mat-v5", s + ".mat"), {"conn": matrix(k)})
    scipy.io.savemat(os.path.join("mat-v5-compressed", s + ".mat"),
                     {"conn": matrix(k), "age": np.array([[30.0 + k]])}, do_compression=True)

# the stack's first axis follows order.txt (s3, s1, s2), not the subjects table
ORDER = ["s3", "s1", "s2"]
stack = np.stack([matrix(SUBJECTS.index(s) + 1) for s in ORDER])
with open("order.txt", "w") as f:
    f.write("\n".join(ORDER) + "\n")
with open("labels.txt", "w") as f:
    f.write("lh-frontal\nlh-parietal\nrh-frontal\nrh-parietal\n")
np.save("stacked.npy", stack)
write_npy("stacked-f4-be-fortran-v2.npy", np.asfortranarray(stack.astype(">f4")), (2, 0))
scipy.io.savemat("stacked.mat", {"thickness": stack, "area": stack * 2})
scipy.io.savemat("stacked-last.mat", {"thickness": np.moveaxis(stack, 0, 2)})  # regions x regions x subjects

scipy.io.savemat("v4.mat", {"conn": matrix(1)}, format="4")
# a MATLAB v7.3 file is HDF5 behind a 128-byte text header; h5py is not installed, so only the header is written
# (what a reader sees first): the text MATLAB writes, padded to 116 bytes, subsystem offset, version 0x0200, "IM"
head = b"MATLAB 7.3 MAT-file, Platform: GLNXA64, Created on: Thu Dec  3 05:00:00 2026 HDF5 schema 1.00 ."
with open("v73.mat", "wb") as f:
    f.write(head.ljust(116, b" ") + b"\0" * 8 + b"\x00\x02" + b"IM" + b"\0" * 384 + b"\x89HDF\r\n\x1a\n")

# non-symmetric 2 x 3 arrays, a[i][j] = 10*i + j (times 1.5 for the float one), to check element order directly
raw = np.array([[10 * i + j for j in range(3)] for i in range(2)])
write_npy("raw-2x3-f8-le-fortran-v1.npy", np.asfortranarray(raw * 1.5), (1, 0))
write_npy("raw-2x3-i2-be-c-v1.npy", raw.astype(">i2"), (1, 0))
write_npy("raw-2x3-u1-fortran-v1.npy", np.asfortranarray(raw.astype("u1")), (1, 0))

# cohort12/: a 12-subject cohort (a1..a12) for command-line tests: the source view stacked in one .npy file in the
# order of order.txt (a12 first, down to a1), the target view one .mat file per subject (variable 'area'), missing
# for a11 and a12; values are seeded random symmetric 4 x 4 matrices with a group difference on one edge
rng = np.random.default_rng(2026)
os.makedirs("cohort12/area", exist_ok=True)
ids = ["a%d" % i for i in range(1, 13)]
with open("cohort12/subjects.csv", "w") as f:
    f.write("subject,group\n" + "".join("%s,%s\n" % (s, "patient" if i % 2 == 0 else "control")
                                        for i, s in enumerate(ids, start=1)))
order = list(reversed(ids))
with open("cohort12/order.txt", "w") as f:
    f.write("\n".join(order) + "\n")


def sym(shift):
    a = rng.normal(size=(R, R))
    a = (a + a.T) / 2
    a[0, 1] = a[1, 0] = a[0, 1] + shift
    np.fill_diagonal(a, 0.0)
    return a


np.save("cohort12/thickness.npy", np.stack([sym(2.0 * (int(s[1:]) % 2 == 0)) for s in order]))
for i, s in enumerate(ids, start=1):
    if i <= 10:
        scipy.io.savemat("cohort12/area/%s.mat" % s, {"area": sym(2.0 * (i % 2 == 0))})
