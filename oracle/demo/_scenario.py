"""The scenario as data: the library, its history, its defects and its sound roles.

Every defect names a witness (an input where the library is wrong), an
ordinary input (where it is right) and ``first_wrong``: the smallest input at
which the role goes wrong -- for primes_in, the smallest prime it loses.  An
audit's first divergence lands exactly there for the counting roles (by
bisection) and for primes_in; for is_prime and factor it is the smallest
failing *sampled* input, which the pseudoprime families make ``first_wrong``
itself; the demo's success check compares it.  ``maximum`` is the
domain the target declares (the audit's ``--max``): checks above it are
skipped, never passed.
"""

from __future__ import annotations

from dataclasses import dataclass

__all__ = ["Defect", "SoundRole", "Scenario", "SCENARIO"]

_LIBRARY = "oracle.demo.brindle"


@dataclass(frozen=True)
class Defect:
    """One documented defect of the library."""

    role: str
    target: str
    title: str
    description: str
    witness: tuple[int, ...]
    ordinary: tuple[int, ...]
    first_wrong: int
    maximum: int | None = None


@dataclass(frozen=True)
class SoundRole:
    """A role the library plays correctly (within its declared domain)."""

    role: str
    target: str
    description: str
    maximum: int | None = None


@dataclass(frozen=True)
class Scenario:
    """The bundled demo: an invented organisation's legacy library and the truth about it."""

    library: str
    organisation: str
    history: str
    defects: tuple[Defect, ...]
    sound: tuple[SoundRole, ...]

    def roles(self) -> tuple[str, ...]:
        """Every role of the library: the defective ones first, then the sound ones."""
        return tuple(entry.role for entry in (*self.defects, *self.sound))

    def entry(self, role: str) -> Defect | SoundRole:
        """The defect or sound role documented for ``role``."""
        for entry in (*self.defects, *self.sound):
            if entry.role == role:
                return entry
        raise KeyError(role)

    def discrepancies(self, passed: dict[str, bool],
                      first_wrong: dict[str, int | None] | None = None) -> list[str]:
        """What an audit found that the scenario does not document, one sentence each.

        ``passed`` maps each role to whether its audit passed; ``first_wrong``, when given,
        to the first wrong input the audit localised (the first divergence's input, or for
        primes_in the first lost prime).  The list is empty exactly when every defective
        role failed at its documented ``first_wrong`` and every sound role passed.
        """
        problems = []
        for role in self.roles():
            entry = self.entry(role)
            if role not in passed:
                problems.append(f"{role}: not audited")
            elif isinstance(entry, Defect) and passed[role]:
                problems.append(f"{role}: the documented defect was not found")
            elif isinstance(entry, Defect) and first_wrong is not None \
                    and first_wrong.get(role) != entry.first_wrong:
                problems.append(f"{role}: first wrong input {first_wrong.get(role)}, documented "
                                f"{entry.first_wrong}")
            elif isinstance(self.entry(role), SoundRole) and not passed[role]:
                problems.append(f"{role}: documented as correct, but the audit failed")
        problems.extend(f"{role}: not part of the scenario" for role in passed
                        if role not in self.roles())
        return problems


_HISTORY = (
    "The Brindlewick Municipal Observatory, an invented town observatory run by volunteers, "
    "has kept a home-grown number library, brindle, since 1987. It began as FORTRAN on the "
    "council's minicomputer, was rewritten in C in 1994 for the plate room's PC, and was "
    "ported to Python in 2009; next_prime was added in 2017. It numbers the plates of the "
    "observatory's sky survey, checks the prime moduli of the plate-catalogue checksums and "
    "prints a 'prime of the night' for visitors. In this scenario the new archivist audits it "
    "before the catalogue moves to a new system: five of its seven routines carry a defect "
    "nobody noticed, because the numbers the observatory used never met them."
)

SCENARIO = Scenario(
    library="brindle",
    organisation="Brindlewick Municipal Observatory (invented)",
    history=_HISTORY,
    defects=(
        Defect(
            role="prime_pi", target=f"{_LIBRARY}.counting:prime_pi",
            title="16-bit block tallies wrap",
            description=(
                "prime_pi adds per-block tallies of the primes in each block of 2**20 numbers, "
                "stored as unsigned 16-bit values (& 0xFFFF) for compatibility with the C "
                "version's table file. The authors judged the density near 10**7 (about 1/16, "
                "some 65 000 primes a block) but the lower blocks hold more: the first block "
                "has pi(2**20) = 82025 primes and its tally wraps to 16489. Every answer from "
                "x = 2**20 on is too small by a multiple of 65536."),
            witness=(2**20,), ordinary=(10**6,), first_wrong=2**20, maximum=2**24),
        Defect(
            role="twin_pi", target=f"{_LIBRARY}.counting:twin_pi",
            title="forgets the twin pair (3, 5)",
            description=(
                "twin_pi only looks at pairs (6k - 1, 6k + 1). Every twin pair but one has "
                "that form; (3, 5) does not, because 3 is itself the multiple of 3. Every "
                "answer from x = 5 on is one too small."),
            witness=(5,), ordinary=(4,), first_wrong=5, maximum=2**24),
        Defect(
            role="is_prime", target=f"{_LIBRARY}.primality:is_prime",
            title="too few Miller-Rabin bases",
            description=(
                "is_prime runs the strong test to the bases 2, 3, 5 and 7, believed to settle "
                "every 32-bit number. They settle only n < 3215031751 = 151 * 751 * 28351, the "
                "smallest strong pseudoprime to all four bases, which is below 2**32; above it "
                "more such pseudoprimes are called prime."),
            witness=(3215031751,), ordinary=(2**31 - 1,), first_wrong=3215031751),
        Defect(
            role="primes_in", target=f"{_LIBRARY}.listing:primes_in",
            title="loses the last number of every 2**15 segment",
            description=(
                "primes_in sieves aligned segments of 2**15 numbers. The caller passes the "
                "segment's last number as an inclusive end, but the segment sieve treats its "
                "end as exclusive, so every number m * 2**15 - 1 is never examined. The first "
                "prime lost is 131071 = 2**17 - 1; 524287 = 2**19 - 1 goes the same way."),
            witness=(131000, 131100), ordinary=(100, 200), first_wrong=131071, maximum=2**32),
        Defect(
            role="factor", target=f"{_LIBRARY}.factoring:factor",
            title="trusts a strong pseudoprime cofactor",
            description=(
                "After trial division by the primes below 1000, factor accepts any cofactor "
                "that passes one strong test to base 2 as prime. A strong pseudoprime to base 2 "
                "whose prime factors all exceed 1000 comes back as a single 'prime': the first "
                "is 1194649 = 1093**2 (1093 is a Wieferich prime); 25326001 = 2251 * 11251 is "
                "another."),
            witness=(1194649,), ordinary=(2**32 + 1,), first_wrong=1194649, maximum=2**64),
    ),
    sound=(
        SoundRole(
            role="nth_prime", target=f"{_LIBRARY}.sequence:nth_prime",
            description="reads p_n from the prime table; its domain is n <= pi(2**24) = 1077871.",
            maximum=1077871),
        SoundRole(
            role="next_prime", target=f"{_LIBRARY}.primality:next_prime",
            description=("the prime table below 2**24, above it the strong test to the first "
                         "twelve prime bases, deterministic below 3.18 * 10**23 (Sorenson and "
                         "Webster 2017); its domain is n <= 2**64."),
            maximum=2**64),
    ),
)
