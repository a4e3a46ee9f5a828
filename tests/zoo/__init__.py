"""The zoo: candidate implementations, correct and deliberately defective, on which
ntoracle's audit is measured.  See ``catalogue.yaml`` for what each member is.

These are test fixtures, not code to use: the defective members are wrong on
purpose, and the correct ones are only as good as the libraries they wrap (a
probable prime is not a proven prime).  For cryptographic work defer to the
published standards and a vetted library.
"""
