"""Which EPSG geodetic datums QaService routes between, and which grid files make a grid operation usable.

Shared by src/QaService.Core/Geodesy/Catalog/make-epsg-catalog.py (the CRS catalog) and
tools/geodesy/make-helmert-table.py (the Helmert and grid tables), so both select the same datums.

Hubs: the WGS 84, ITRF, ETRS89/ETRF, NAD83 and GDA frames the service started with, plus every ITRF realisation.
Linked: every non-deprecated datum on the Greenwich meridian that proj.db joins to a hub by one non-deprecated
EPSG Helmert transformation of a method QaService implements (HELMERT_METHODS), or by an NTv2 grid transformation
whose grid file is in the local PROJ data folder (Debian proj-data). Datums reached only by other methods
(Molodensky-Badekas, NADCON, time-specific Helmert, grids proj-data does not ship) stay out; the generators print
them to stderr.
"""
import os

HUBS = [
    6326, 1166, 1152, 1153, 1154, 1155, 1156, 1309,          # WGS 84 ensemble and realisations
    6656, 6896, 1061, 1165, 1322,                            # ITRF2000, 2005, 2008, 2014, 2020
    6258, 1178, 1179, 1180, 1181, 1182, 1183, 1184, 1185,    # ETRS89 ensemble, ETRF89..ETRF97
    1186, 1204, 1206,                                        # ETRF2000, ETRF2005, ETRF2014
    6269, 1116, 6140,                                        # NAD83, NAD83(2011), NAD83(CSRS)
    6283, 1168,                                              # GDA94, GDA2020
]

# EPSG Helmert methods: (convention, time-dependent). 1065/1066 (time-specific) are left out: valid at one epoch only.
HELMERT_METHODS = {
    1031: ("PositionVector", False), 1035: ("PositionVector", False), 9603: ("PositionVector", False),
    1033: ("PositionVector", False), 9606: ("PositionVector", False),
    1032: ("CoordinateFrame", False), 9607: ("CoordinateFrame", False),
    1053: ("PositionVector", True), 1056: ("CoordinateFrame", True),
}

NTV2 = 9615
GREENWICH = 8901
GRID_PACKAGE = "proj-data"


def grid_files(folder):
    """Lower-case name -> actual file name of the grids in the PROJ data folder (EPSG and Debian differ in case)."""
    return {n.lower(): n for n in os.listdir(folder)} if os.path.isdir(folder) else {}


def _usable_datums(q):
    return {int(c) for (c,) in q("select code from geodetic_datum where auth_name='EPSG' and deprecated=0 "
                                 "and prime_meridian_auth_name='EPSG' and prime_meridian_code=?", (GREENWICH,))}


def helmert_links(q):
    """(code, method, source datum, target datum) of every non-deprecated EPSG Helmert with an accuracy."""
    return [(int(c), int(m), int(s), int(t)) for c, m, s, t in q(
        "select h.code, h.method_code, gs.datum_code, gt.datum_code from helmert_transformation_table h "
        "join geodetic_crs gs on gs.auth_name=h.source_crs_auth_name and gs.code=h.source_crs_code "
        "join geodetic_crs gt on gt.auth_name=h.target_crs_auth_name and gt.code=h.target_crs_code "
        "where h.auth_name='EPSG' and h.deprecated=0 and h.accuracy is not null and gs.datum_auth_name='EPSG' "
        "and gt.datum_auth_name='EPSG' and gs.datum_code<>gt.datum_code")]


def grid_links(q, folder):
    """(code, source datum, target datum, file, file inverse?) of every non-deprecated EPSG NTv2 operation
    whose grid (PROJ name, old PROJ name or EPSG name, case-insensitively) is in the data folder; and those whose grid is not."""
    files = grid_files(folder)
    present, absent = [], []
    for code, sd, td, grid, new, old, inverse in q(
            "select g.code, gs.datum_code, gt.datum_code, g.grid_name, ga.proj_grid_name, ga.old_proj_grid_name, "
            "coalesce(ga.inverse_direction, 0) from grid_transformation g "
            "join geodetic_crs gs on gs.auth_name=g.source_crs_auth_name and gs.code=g.source_crs_code "
            "join geodetic_crs gt on gt.auth_name=g.target_crs_auth_name and gt.code=g.target_crs_code "
            "left join grid_alternatives ga on ga.original_grid_name=g.grid_name "
            "where g.auth_name='EPSG' and g.deprecated=0 and g.method_code=? and g.accuracy is not null "
            "and gs.datum_code<>gt.datum_code", (NTV2,)):
        found = next((files[n.lower()] for n in (new, old, grid) if n and n.lower() in files), None)
        row = (int(code), int(sd), int(td), found or (old or new or grid), bool(inverse))
        (present if found else absent).append(row)
    return present, absent


def datums(q, folder="/usr/share/proj"):
    """Hubs first, then the linked datums in code order."""
    usable = _usable_datums(q)
    hubs = set(HUBS) | {int(c) for (c,) in q("select code from geodetic_datum where auth_name='EPSG' and deprecated=0 "
                                            "and name like 'International Terrestrial Reference Frame %'")}
    linked = set()
    for _, method, s, t in helmert_links(q):
        if method in HELMERT_METHODS and (s in hubs) != (t in hubs):
            linked.add(t if s in hubs else s)
    present, _ = grid_links(q, folder)
    for _, s, t, _, _ in present:
        if (s in hubs) != (t in hubs):
            linked.add(t if s in hubs else s)
    extra_hubs = sorted(hubs - set(HUBS))
    return [d for d in HUBS + extra_hubs + sorted(linked - hubs) if d in usable]
