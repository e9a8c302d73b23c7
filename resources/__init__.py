"""Published data tables and demo files shipped with Zeffir (installed as ``zeffir.resources``)."""
