"""ntoracle: a reference oracle for testing number-theory software."""
