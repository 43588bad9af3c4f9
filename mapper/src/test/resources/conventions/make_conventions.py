#!/usr/bin/env python3
"""Writes the invented point lists and answer keys of the six naming conventions (fictional sites).

Each convention dir gets points.csv (as a BAS would export it) and answer-key.csv (device, point,
expected_class, expected_equipment, expected_part_class) for its terminal-unit points. The answer key is
written from what each generated point *is* (the kind it was generated from), never from the mapper.
rules.tufa beside them is written by hand. Rerun from this directory (standard library only):
    /usr/bin/python3 make_conventions.py
Patterns follow ../shared/field/notes.md section 7 (names are our own, sites are fictional).
"""
import csv
import random

KINDS = {  # kind: (truth class, part class, object type, quantity)
    "zt": ("Zone_Air_Temperature_Sensor", "", "AI", "temp"),
    "dat": ("Discharge_Air_Temperature_Sensor", "", "AI", "temp"),
    "cv": ("Valve_Position_Command", "Chilled_Water_Valve", "AO", "pct"),
    "hv": ("Valve_Position_Command", "Hot_Water_Valve", "AO", "pct"),
    "fspd": ("Fan_Speed_Command", "Fan", "MSV", ""),
    "fst": ("Fan_Status", "Fan", "BI", ""),
    "fss": ("Start_Stop_Command", "Fan", "BO", ""),
    "occ": ("Occupied_Mode_Status", "", "BV", ""),
    "csp": ("Cooling_Zone_Air_Temperature_Setpoint", "", "AV", "temp"),
    "hsp": ("Heating_Zone_Air_Temperature_Setpoint", "", "AV", "temp"),
    "oad": ("Damper_Position_Command", "", "AO", "pct"),
    "cond": ("Condensate_Leak_Alarm", "", "BI", ""),
}
# probability that a unit has the point (zone temp, setpoints, cooling valve, fan s/s always)
PRESENCE = {"zt": 1, "csp": 1, "hsp": 1, "cv": 1, "fss": 1, "hv": 0.9, "occ": 0.9, "fspd": 0.8,
            "dat": 0.7, "fst": 0.6, "oad": 0.3, "cond": 0.3}
TYPE_SPELLING = {"AI": "analog-input", "AO": "analog-output", "AV": "analog-value", "BI": "binary-input",
                 "BO": "binary-output", "BV": "binary-value", "MSV": "multi-state-value"}
TYPE_WORDS = {"AI": "Analog Input", "AO": "Analog Output", "AV": "Analog Value", "BI": "Binary Input",
              "BO": "Binary Output", "BV": "Binary Value", "MSV": "Multi-State Value"}


def units_for(quantity, temp_unit, pct="%"):
    return temp_unit if quantity == "temp" else pct if quantity == "pct" else ""


def units_of(floors, per_floor):
    return [(f, u) for f in floors for u in range(1, per_floor + 1)]


def kinds_for(rng):
    return [k for k in KINDS if rng.random() < PRESENCE[k]]


def write(name, header, rows, key_rows, delimiter=",", bom=False):
    with open(f"{name}/points.csv", "w", newline="", encoding="utf-8-sig" if bom else "utf-8") as f:
        w = csv.writer(f, delimiter=delimiter, lineterminator="\r\n")
        w.writerow(header)
        w.writerows(rows)
        f.write("\r\n")  # a blank trailing line, as some exports end
    with open(f"{name}/answer-key.csv", "w", newline="", encoding="utf-8") as f:
        w = csv.writer(f, lineterminator="\n")
        w.writerow(["device", "point", "expected_class", "expected_equipment", "expected_part_class"])
        w.writerows(key_rows)


def dotted():
    rng = random.Random(101)
    sfx = {"zt": "ZN-TEMP", "dat": "DA-TEMP", "cv": "CHW-VLV-CMD", "hv": "HW-VLV-CMD", "fspd": "FAN-SPD-CMD",
           "fst": "FAN-STAT", "fss": "FAN-SS-CMD", "occ": "OCC-MODE", "csp": "ZN-CLG-STPT", "hsp": "ZN-HTG-STPT",
           "oad": "OAD-POS-CMD", "cond": "COND-ALM"}
    rows, key = [], []
    n = 0
    for f, u in units_of(range(2, 6), 4):
        for k in kinds_for(rng):
            n += 1
            s = sfx[k]
            if (f, u, k) == (4, 3, "cv"):
                s = "CLG-VLV-CMD"  # a legacy unit named by another integrator
            name = f"MQ.T1.L{f:02d}.FCU{f:02d}{u:02d}.{s}"
            cls, part, t, q = KINDS[k]
            rows.append([name, "", units_for(q, "°F"), t, f"MQ-NC{f:02d}", f"TL{n:05d}"])
            key.append(["", name, cls, f"FCU-{f:02d}-{u:02d}", part])
    for name, t, un in [("MQ.T1.L00.AHU01.SA-TEMP", "AI", "°F"), ("MQ.T1.PLANT.CHWS-TEMP", "AI", "°F"),
                        ("MQ.T1.PLANT.HWS-TEMP", "AI", "°F"), ("MQ.T1.L00.OA-TEMP", "AI", "°F"),
                        ("MQ.T1.L00.AHU01.SF-SS-CMD", "BO", "")]:
        n += 1
        rows.append([name, "", un, t, "MQ-PLC1", f"TL{n:05d}"])
    write("dotted", ["Point Name", "Description", "Units", "Object Type", "Device", "Trend ID"], rows, key)


def underscore():
    rng = random.Random(202)
    sfx = {"zt": "ZNT", "dat": "DAT", "cv": "CLV", "hv": "HTV", "fspd": "FSPD", "fst": "FST", "fss": "FSS",
           "occ": "OCC", "csp": "EFFCSP", "hsp": "EFFHSP", "oad": "OADP", "cond": "CDA"}
    truth = dict((k, v[0]) for k, v in KINDS.items())
    truth["csp"] = "Effective_Cooling_Zone_Air_Temperature_Setpoint"
    truth["hsp"] = "Effective_Heating_Zone_Air_Temperature_Setpoint"
    rows, key = [], []
    for f, u in units_of(range(1, 4), 6):
        for k in kinds_for(rng):
            name = f"AGC_FC{f}{u:02d}_{sfx[k]}"
            _, part, t, q = KINDS[k]
            rows.append([name, "", units_for(q, "°C"), t, f"AGC-DDC{f}"])
            key.append(["", name, truth[k], f"FC-{f}{u:02d}", part])
    for name, t, un in [("AGC_AHU1_SAT", "AI", "°C"), ("AGC_CHW_SWT", "AI", "°C"), ("AGC_OAT", "AI", "°C")]:
        rows.append([name, "", un, t, "AGC-PLANT"])
    write("underscore", ["Name", "Description", "Unit", "Type", "Controller"], rows, key, delimiter=";", bom=True)


def nodelim():
    rng = random.Random(303)
    sfx = {"zt": "RT", "dat": "SAT", "cv": "CCV", "hv": "HCV", "fspd": "FSC", "fst": "FST", "fss": "FSS",
           "occ": "OCC", "csp": "CSP", "hsp": "HSP", "oad": "ODC", "cond": "CDA"}
    truth = dict((k, v[0]) for k, v in KINDS.items())
    truth["dat"] = "Supply_Air_Temperature_Sensor"
    rows, key = [], []
    for f, u in units_of(range(1, 5), 4):
        for k in kinds_for(rng):
            name = f"BYD2L{f:02d}FC{u:02d}{sfx[k]}"
            _, part, t, q = KINDS[k]
            rows.append([name, "", units_for(q, "degF", "percent"), TYPE_SPELLING[t]])
            key.append(["", name, truth[k], f"FC{f:02d}{u:02d}", part])
    for name, t, un in [("BYD2AHU1SAT", "AI", "degF"), ("BYD2CHWST", "AI", "degF"), ("BYD2OAT", "AI", "degF")]:
        rows.append([name, "", un, TYPE_SPELLING[t]])
    write("nodelim", ["PointName", "Desc", "EngUnits", "ObjectType"], rows, key, delimiter="\t")


def tree():
    rng = random.Random(404)
    sfx = {"zt": "SpaceTemperature", "dat": "SupplyAirTemp", "cv": "ChilledWaterValve", "hv": "HotWaterValve",
           "fspd": "FanSpeedCommand", "fst": "FanRunStatus", "fss": "FanStartStop", "occ": "OccupiedMode",
           "csp": "CoolingSetpoint", "hsp": "HeatingSetpoint", "oad": "OutsideAirDamper",
           "cond": "CondensateAlarm"}
    truth = dict((k, v[0]) for k, v in KINDS.items())
    truth["dat"] = "Supply_Air_Temperature_Sensor"
    rows, key = [], []
    for f, u in units_of(range(1, 4), 5):
        for k in kinds_for(rng):
            name = f"/CorvidLib/Level_{f}/FanCoil_{f}_{u:02d}/{sfx[k]}"
            _, part, t, q = KINDS[k]
            # this export leaves the units of setpoints empty: the rule file's defaults fill them in
            unit = "" if k in ("csp", "hsp") else units_for(q, "°F")
            rows.append([name, f"Fan coil {f}.{u:02d} {sfx[k]}", unit, t])
            key.append(["", name, truth[k], f"FCU-{f}-{u:02d}", part])
    for name, t, un in [("/CorvidLib/Plant/ChilledWaterSupplyTemp", "AI", "°F"),
                        ("/CorvidLib/Roof/AHU_1/SupplyAirTemp", "AI", "°F"),
                        ("/CorvidLib/Roof/OutsideAirTemp", "AI", "°F")]:
        rows.append([name, "", un, t])
    write("tree", ["Object Name", "Description", "Units", "BACnet Type"], rows, key)


def descriptive():
    rng = random.Random(505)
    sfx = {"zt": "Room Temp", "dat": "Disch Air Temp", "cv": "Chw Valve Output", "hv": "Hw Valve Output",
           "fspd": "Fan Speed Cmd", "fst": "Fan Run Proof", "fss": "Fan Start Stop", "occ": "Occ Mode",
           "csp": "Cool Setpt", "hsp": "Heat Setpt", "oad": "OA Damper Output", "cond": "Drain Pan Alarm"}
    rows, key = [], []
    for f, u in units_of(range(1, 5), 4):
        for k in kinds_for(rng):
            name = f"DH FCU {f}.{u:02d} {sfx[k]}"
            cls, part, t, q = KINDS[k]
            rows.append([name, TYPE_WORDS[t], f"DH-FCU-{f}{u:02d}"])
            key.append(["", name, cls, f"FCU-{f}.{u:02d}", part])
    for name, t in [("DH AHU 1 Supply Air Temp", "AI"), ("DH CHW Supply Temp", "AI"), ("DH Outside Air Temp", "AI")]:
        rows.append([name, TYPE_WORDS[t], "DH-PLANT"])
    # no units column at all: the rule file's unit-for lines give the units
    write("descriptive", ["Name", "Object Type", "Controller"], rows, key)


def objectid():
    rng = random.Random(606)
    obj = {"zt": ("AI1", "Space Temp"), "dat": ("AI2", "Discharge Temp"), "cv": ("AO1", "Cool Vlv"),
           "hv": ("AO2", "Heat Vlv"), "fspd": ("MSV1", "Fan Speed"), "fst": ("BI1", "Fan Status"),
           "fss": ("BO1", "Fan S/S"), "occ": ("BV1", "Occupancy Mode"), "csp": ("AV1", "Occ Clg SP"),
           "hsp": ("AV2", "Occ Htg SP"), "oad": ("AO3", "OA Dmpr"), "cond": ("BI2", "Condensate Overflow")}
    truth = dict((k, v[0]) for k, v in KINDS.items())
    truth["csp"] = "Occupied_Cooling_Temperature_Setpoint"
    truth["hsp"] = "Occupied_Heating_Temperature_Setpoint"
    rows, key = [], []
    n = 0
    for f, u in units_of(range(1, 4), 5):
        dev = 2000 + 100 * f + u
        for k in kinds_for(rng):
            n += 1
            name, desc = obj[k]
            _, part, t, q = KINDS[k]
            rows.append([dev, name, TYPE_WORDS[t], desc, units_for(q, "degC", "percent") or "no-units",
                         f"{dev}.{name}"])
            key.append([str(dev), name, truth[k], f"FCU-{dev}", part])
    for name, desc in [("AI1", "CHW Supply Temp"), ("AI2", "HW Supply Temp"), ("AI3", "Outside Air Temp")]:
        rows.append([1000, name, "Analog Input", desc, "degC", f"1000.{name}"])
    write("objectid", ["Device Instance", "Object Name", "Object Type", "Description", "Units", "Trend Log"],
          rows, key)


if __name__ == "__main__":
    import os
    for d in ("dotted", "underscore", "nodelim", "tree", "descriptive", "objectid"):
        os.makedirs(d, exist_ok=True)
    dotted(); underscore(); nodelim(); tree(); descriptive(); objectid()
