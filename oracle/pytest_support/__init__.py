"""Private machinery of the pytest plugin (:mod:`oracle.plugin`).

* :mod:`._settings` -- the options and ini keys, resolved with command line > ini > default, and the per-target settings;
* :mod:`._suites` -- the YAML suite format: parsing with line numbers, points of each case;
* :mod:`._judging` -- asking a target at a group of points and judging the answers with the
  audit engine (:mod:`oracle.engine`);
* :mod:`._messages` -- the failure message of a check item;
* :mod:`._nodes` -- the pytest collectors and items;
* :mod:`._fixtures` -- the objects behind the fixtures of hand-written tests;
* :mod:`._reproduce` -- the command line that re-runs exactly one item;
* :mod:`._session` -- the session per role and target: verdict, reach, the HTML report.

Nothing here is imported until a hook needs it, so a session without targets
and without suite files costs the import of :mod:`oracle.plugin` alone.
"""
