"""The bundled demo scenario of ``ntoracle demo``: a legacy library with documented defects.

The story, all of it invented: the Brindlewick Municipal Observatory, a
volunteer-run town observatory, has kept a home-grown number library,
*brindle* (:mod:`oracle.demo.brindle`), since 1987 -- FORTRAN first, C in
1994, Python since 2009.  It numbers survey plates and checks catalogue
checksums.  Before the catalogue moves to a new system, a new archivist audits
it.  Five routines carry a defect nobody noticed (a 16-bit tally that wraps,
a twin counter that forgets (3, 5), too few Miller--Rabin bases, a segmented
sieve that loses the last number of each segment, a factoriser that trusts a
strong pseudoprime cofactor); nth_prime and next_prime are correct.

:data:`SCENARIO` is the truth the audit is measured against: for each role
the target (``package.module:function``), the declared domain, and for each
defect a witness input, an ordinary input where the routine is right, and the
smallest input where it first goes wrong.

>>> from oracle.demo import SCENARIO
>>> SCENARIO.roles()
('prime_pi', 'twin_pi', 'is_prime', 'primes_in', 'factor', 'nth_prime', 'next_prime')
>>> SCENARIO.entry("twin_pi").witness
(5,)

Passing an audit is evidence, not a certificate; a library like this one must
not be used for cryptography -- defer to the published standards and a vetted
library there.
"""

from ._run import DEMO_SEED, run_demo
from ._scenario import SCENARIO, Defect, Scenario, SoundRole

__all__ = ["SCENARIO", "Defect", "Scenario", "SoundRole", "run_demo", "DEMO_SEED"]
