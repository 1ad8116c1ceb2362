#!/usr/bin/env python3
"""Writes the malformed scenario files of this folder and index.csv from one small valid base.

Run from this folder: python3 gen_bad_files.py
"""
import json, copy, re

base = {
  "format": "nanoplan/1",
  "name": "small valid base for the malformed-file tests",
  "volume": {"shape": "box", "min_um": [0.0, 0.0, 0.0], "max_um": [200.0, 200.0, 200.0]},
  "medium": {"temperature_K": 310.15, "viscosity_mPa_s": 0.69, "flow": {"profile": "none"}, "background_molecules_per_s": 0.0},
  "species": [{"name": "A", "diffusion_um2_per_s": 100.0, "half_life_s": None}],
  "signalling": {"symbol_time_s": 1.0, "isi_memory_symbols": 5, "levels": 2, "prior_one": 0.5, "count_model": "exact", "schedule": "all-active"},
  "nodes": [
    {"id": "tx1", "role": "transmitter", "position_um": [50.0, 100.0, 100.0], "radius_um": 2.0, "species": "A", "molecules_per_symbol": 5000},
    {"id": "rx", "role": "receiver", "position_um": [100.0, 100.0, 100.0], "radius_um": 5.0, "species": "A"},
    {"id": "relay1", "role": "relay", "position_um": [150.0, 100.0, 100.0], "radius_um": 4.0, "species": "A", "emits_species": "A", "molecules_per_symbol": 3000}
  ],
  "demands": [{"from": "tx1", "to": "rx"}],
  "targets": {"max_error_probability": 0.001, "min_rate_bits_per_s": 0.1, "mission_duration_s": 3600.0}
}

def text(d):
    s = json.dumps(d, indent=2)
    return re.sub(r'\[\s+([^\[\]{}]*?)\s+\]', lambda m: '[' + re.sub(r'\s+', ' ', m.group(1)) + ']', s) + "\n"

rows = []
def bad(name, path, schema, what, mutate=None, raw=None):
    d = copy.deepcopy(base)
    if mutate:
        mutate(d)
    t = raw(text(base)) if raw else text(d)
    open(name + ".json", "w").write(t)
    rows.append((name + ".json", path, "yes" if schema else "no", what))

def setp(path, value):
    def f(d):
        o = d
        for k in path[:-1]:
            o = o[k]
        o[path[-1]] = value
    return f
def delp(*keys):
    def f(d):
        o = d
        for k in keys[:-1]:
            o = o[k]
        del o[keys[-1]]
    return f

bad("format-version", "format", True, "unknown format version", setp(["format"], "nanoplan/2"))
bad("format-missing", "format", True, "missing format", delp("format"))
bad("format-number", "format", True, "format is a number", setp(["format"], 1))
bad("volume-missing", "volume", True, "missing volume", delp("volume"))
bad("volume-shape-unknown", "volume.shape", True, "unknown shape", setp(["volume", "shape"], "sphere"))
bad("box-max-below-min", "volume.max_um", False, "box max not above min", setp(["volume", "max_um"], [200.0, 0.0, 200.0]))
def cyl_neg(d):
    d["volume"] = {"shape": "cylinder", "radius_um": -5.0, "length_um": 300.0}
bad("cylinder-negative-radius", "volume.radius_um", True, "negative cylinder radius", cyl_neg)
bad("species-missing", "species", True, "missing species", delp("species"))
bad("species-empty", "species", True, "empty species list", setp(["species"], []))
bad("diffusion-negative", "species[0].diffusion_um2_per_s", True, "negative diffusion", setp(["species", 0, "diffusion_um2_per_s"], -100.0))
bad("diffusion-string", "species[0].diffusion_um2_per_s", True, "diffusion given as text", setp(["species", 0, "diffusion_um2_per_s"], "fast"))
bad("diffusion-and-radius", "species[0].hydrodynamic_radius_nm", True, "both diffusion and radius", setp(["species", 0, "hydrodynamic_radius_nm"], 1.0))
bad("diffusion-none", "species[0].diffusion_um2_per_s", True, "neither diffusion nor radius", delp("species", 0, "diffusion_um2_per_s"))
bad("half-life-zero", "species[0].half_life_s", True, "zero half-life", setp(["species", 0, "half_life_s"], 0))
def unused(d):
    d["species"].append({"name": "B", "diffusion_um2_per_s": 200.0, "half_life_s": None})
bad("species-unused", "species[1].name", False, "a species no node uses", unused)
def dup_species(d):
    d["species"].append({"name": "A", "diffusion_um2_per_s": 200.0, "half_life_s": None})
bad("species-duplicate", "species[1].name", False, "species declared twice", dup_species)
bad("symbol-time-zero", "signalling.symbol_time_s", True, "zero symbol time", setp(["signalling", "symbol_time_s"], 0))
bad("symbol-time-missing", "signalling.symbol_time_s", True, "missing symbol time", delp("signalling", "symbol_time_s"))
bad("levels-1", "signalling.levels", True, "one level", setp(["signalling", "levels"], 1))
bad("levels-17", "signalling.levels", True, "seventeen levels", setp(["signalling", "levels"], 17))
bad("levels-fraction", "signalling.levels", True, "fractional levels", setp(["signalling", "levels"], 2.5))
bad("prior-1.5", "signalling.prior_one", True, "prior above one", setp(["signalling", "prior_one"], 1.5))
bad("count-model-unknown", "signalling.count_model", True, "unknown count model", setp(["signalling", "count_model"], "binomial"))
bad("schedule-unknown", "signalling.schedule", True, "unknown schedule", setp(["signalling", "schedule"], "token-ring"))
bad("isi-memory-negative", "signalling.isi_memory_symbols", True, "negative ISI memory", setp(["signalling", "isi_memory_symbols"], -1))
bad("nan-symbol-time", "signalling.symbol_time_s", False, "NaN literal", raw=lambda t: t.replace('"symbol_time_s": 1.0', '"symbol_time_s": NaN'))
bad("infinity-radius", "nodes[1].radius_um", False, "Infinity literal", raw=lambda t: t.replace('"radius_um": 5.0', '"radius_um": Infinity'))
bad("huge-number", "targets.mission_duration_s", False, "number overflowing a double", raw=lambda t: t.replace('"mission_duration_s": 3600.0', '"mission_duration_s": 1e400'))
bad("radius-negative", "nodes[1].radius_um", True, "negative radius", setp(["nodes", 1, "radius_um"], -2))
bad("radius-missing", "nodes[0].radius_um", True, "missing radius", delp("nodes", 0, "radius_um"))
bad("radius-boolean", "nodes[2].radius_um", True, "radius is a boolean", setp(["nodes", 2, "radius_um"], True))
bad("position-two-components", "nodes[0].position_um", True, "position with two numbers", setp(["nodes", 0, "position_um"], [1.0, 2.0]))
bad("position-string-component", "nodes[0].position_um[1]", True, "position component is text", setp(["nodes", 0, "position_um"], [50.0, "100", 100.0]))
bad("node-outside-box", "nodes[1].position_um", False, "receiver body crosses the box wall", setp(["nodes", 1, "position_um"], [100.0, 197.0, 100.0]))
def outside_cyl(d):
    d["volume"] = {"shape": "cylinder", "radius_um": 50.0, "length_um": 300.0}
    d["nodes"][0]["position_um"] = [50.0, 0.0, 0.0]
    d["nodes"][1]["position_um"] = [100.0, 35.0, 35.0]
    d["nodes"][2]["position_um"] = [150.0, 0.0, 0.0]
bad("node-outside-cylinder", "nodes[1].position_um", False, "receiver beyond the cylinder wall", outside_cyl)
def before_cyl(d):
    outside_cyl(d)
    d["nodes"][1]["position_um"] = [3.0, 0.0, 0.0]
bad("node-before-cylinder-start", "nodes[1].position_um", False, "receiver body crosses x = 0", before_cyl)
bad("nodes-overlap", "nodes[1].position_um", False, "transmitter and receiver bodies overlap", setp(["nodes", 0, "position_um"], [94.0, 100.0, 100.0]))
bad("duplicate-id", "nodes[2].id", False, "two nodes with id rx", setp(["nodes", 2, "id"], "rx"))
bad("id-empty", "nodes[0].id", True, "empty id", setp(["nodes", 0, "id"], ""))
bad("role-unknown", "nodes[0].role", True, "unknown role", setp(["nodes", 0, "role"], "sender"))
bad("species-undeclared", "nodes[2].species", False, "node names an undeclared species", setp(["nodes", 2, "species"], "Z"))
bad("emits-species-undeclared", "nodes[2].emits_species", False, "relay emits an undeclared species", setp(["nodes", 2, "emits_species"], "Q"))
bad("emits-on-transmitter", "nodes[0].emits_species", True, "emits_species on a transmitter", setp(["nodes", 0, "emits_species"], "A"))
bad("molecules-missing", "nodes[0].molecules_per_symbol", True, "transmitter without molecules", delp("nodes", 0, "molecules_per_symbol"))
bad("molecules-fraction", "nodes[0].molecules_per_symbol", True, "fractional molecules", setp(["nodes", 0, "molecules_per_symbol"], 2.5))
bad("molecules-zero", "nodes[2].molecules_per_symbol", True, "relay releasing nothing", setp(["nodes", 2, "molecules_per_symbol"], 0))
bad("nodes-not-array", "nodes", True, "nodes is an object", setp(["nodes"], {}))
bad("demand-unknown-node", "demands[0].to", False, "demand to an unknown id", setp(["demands", 0, "to"], "ghost"))
bad("demand-from-receiver", "demands[0].from", False, "receiver as a demand source", setp(["demands", 0], {"from": "rx", "to": "relay1"}))
bad("demand-to-transmitter", "demands[0].to", False, "transmitter as a demand destination", setp(["demands", 0], {"from": "relay1", "to": "tx1"}))
bad("demand-missing-to", "demands[0].to", True, "demand without destination", delp("demands", 0, "to"))
bad("poiseuille-in-box", "medium.flow.profile", True, "poiseuille flow in a box", setp(["medium", "flow"], {"profile": "poiseuille", "mean_speed_um_per_s": 100.0}))
bad("uniform-flow-no-velocity", "medium.flow.velocity_um_per_s", True, "uniform flow without velocity", setp(["medium", "flow"], {"profile": "uniform"}))
bad("temperature-negative", "medium.temperature_K", True, "negative temperature", setp(["medium", "temperature_K"], -1.0))
bad("max-error-zero", "targets.max_error_probability", True, "zero error target", setp(["targets", "max_error_probability"], 0))
bad("mission-negative", "targets.mission_duration_s", True, "negative mission", setp(["targets", "mission_duration_s"], -60))
bad("unknown-field-top", "colour", True, "unknown top-level field", setp(["colour"], "blue"))
bad("unknown-field-node", "nodes[0].colour", True, "unknown node field", setp(["nodes", 0, "colour"], "blue"))
bad("truncated", "", False, "file ends in the middle", raw=lambda t: t[: t.index('"demands"')])
bad("trailing-content", "", False, "text after the object", raw=lambda t: t + "{}\n")
bad("not-an-object", "", True, "top level is an array", raw=lambda t: "[" + t.strip() + "]\n")
bad("empty", "", False, "empty file", raw=lambda t: "")
bad("duplicate-key", "nodes[0].radius_um", False, "a key twice in one object", raw=lambda t: t.replace('"radius_um": 2.0', '"radius_um": 2.0, "radius_um": 3.0', 1))

with open("index.csv", "w") as f:
    f.write("file,expected_path,schema_rejects,what\n")
    f.write("# Malformed scenario files: file, field path the reader must name (empty = whole document),\n")
    f.write("# whether the JSON Schema must also reject it (no = rule beyond the schema or not parseable JSON), what is wrong.\n")
    f.write("# Generated from one small valid base by gen_bad_files.py in this folder.\n")
    for r in rows:
        f.write(",".join(r) + "\n")
print(len(rows))
