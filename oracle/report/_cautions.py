"""The cautions every report shows (docs/DESIGN.md, "Cautions the product shows")."""

from __future__ import annotations

__all__ = ["CAUTIONS"]

CAUTIONS = (
    "A 'probable' verdict (Baillie-PSW) is not a proof of primality: a probable prime is "
    "not a proven prime.",
    "Passing these checks is evidence, not a certificate of correctness: only the inputs "
    "that were checked were checked.",
    "For cryptographic use, such as key generation, defer to the published standards and "
    "to a vetted library's review, not to this audit.",
)
