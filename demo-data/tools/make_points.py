#!/usr/bin/env python3
"""Write the invented demo building's BAS point export and its answer key.

The building (Wrenfield Chandlery House, fictional) and both controls contracts are invented
for tufa's demo; see demo-data/README.md. Standard library only, no network, seeded: two runs
give identical bytes.

Rerun from the repository root:

    python3 demo-data/tools/make_points.py demo-data/src/main/resources/org/tufa/demo

It writes points.csv and answer-key.csv into the given folder (UTF-8, LF line endings,
header row first) and prints a summary of the deliberate defects in Markdown.

Line numbers ("duplicate of line N") count the header as line 1 of points.csv.
"""
import csv
import io
import random
import re
import sys
from collections import OrderedDict
from pathlib import Path

SEED = 20250311

# FCUs per floor (floor 1 = ground-floor retail, floors 2-12 offices): 150 in all.
FCUS_PER_FLOOR = OrderedDict([(1, 10), (2, 13), (3, 13), (4, 12), (5, 13), (6, 12),
                              (7, 13), (8, 12), (9, 13), (10, 12), (11, 13), (12, 14)])
OLDER_FLOORS = range(1, 7)    # 2008 contract: underscore names, deg F
NEWER_FLOORS = range(7, 13)   # 2021 contract: dotted names, deg C

# Regexes that derive the FCU equipment id FCU-FF-SS from a point name (both conventions).
OLDER_FCU_RE = re.compile(r"^WCH_L(\d{2})_FC(\d{2})_")
NEWER_FCU_RE = re.compile(r"^WCH\.LV\d{2}\.FC(\d{2})(\d{2})\.")

# ---- deliberate defects (listed in the README; the answer key notes each one) ----
NO_DISCHARGE_SENSOR = ["FCU-02-05", "FCU-04-11", "FCU-06-03", "FCU-09-08", "FCU-11-12"]
NO_VALVE = {"FCU-03-02": "heating", "FCU-08-10": "cooling", "FCU-12-06": "heating"}
# (equipment, point kind) -> misspelt token in the name
NAME_MISSPELLINGS = {("FCU-04-09", "dat"): "DSITMP",
                     ("FCU-10-05", "zat"): "Zone.Tmep",
                     ("FCU-02-11", "clg"): "CLGVVL"}
# (equipment, point kind) -> misspelt description
DESC_MISSPELLINGS = {("FCU-08-12", "htg"): "FCU-08-12 Heating Valve Comand",
                     ("AHU-2", "rat"): "AHU 2 RETRUN AIR TEMP"}
# (equipment, point kind) -> reason the unit column is empty
EMPTY_UNIT = {("FCU-07-09", "zat"), ("FCU-05-06", "zsp"), ("CHW-LOOP", "dp")}
UNIT_VARIANTS_PER_CONVENTION = 3
# Floor 12 zone sensors are networked wall sensors exposed as AV, not AI.
AV_ZONE_SENSOR_FLOORS = {12}

# ---- the Ropewalk wing (added 2028, a third controls contract): VAV boxes on AHU-4 ----
# 10 boxes per level 1-4: seats 01-06 on the facade with hot-water reheat, 07-10 interior, cooling only.
WING_FLOORS = range(1, 5)
WING_BOXES_PER_FLOOR = 10
WING_REHEAT_SEATS = range(1, 7)
WING_RE = re.compile(r"^WCH-RW/L(\d)/VAV-(\d)\.(\d{2})/")
# boxes without a discharge-air sensor (airflow-side analysis only)
WING_NO_DISCHARGE = ["RW-VAV-1-04", "RW-VAV-2-09", "RW-VAV-3-02", "RW-VAV-4-08"]
# damper position feedback exists only on levels 3 and 4 (the 2028 actuators on 1-2 have none)
WING_FEEDBACK_FLOORS = {3, 4}
# level 1 airflow points were left in cfm by the balancing contractor
WING_CFM_FLOORS = {1}
WING_NAME_MISSPELLINGS = {("RW-VAV-2-05", "zat"): "ZN-TMP"}

HEADER = ["Point Name", "Description", "Units", "Object Type", "Device", "Trend ID"]
KEY_HEADER = ["point", "expected_class", "expected_equipment", "expected_equipment_class",
              "expected_part_class", "expected_unit", "role", "note"]


class Row:
    """One exported point plus what it should map to."""

    def __init__(self, name, desc, units, otype, device, trended,
                 cls="", equip="", equip_cls="", part="", unit="", role="", note=""):
        self.name, self.desc, self.units, self.otype, self.device = name, desc, units, otype, device
        self.trended = trended
        self.trend = ""
        self.duplicate_of = None      # the Row this one repeats, if any
        self.exact_duplicate = False  # True: same trend id too (export glitch)
        self.cls, self.equip, self.equip_cls, self.part = cls, equip, equip_cls, part
        self.unit, self.role, self.note = unit, role, note

    def duplicate(self, exact):
        r = Row(self.name, self.desc, self.units, self.otype, self.device, self.trended,
                self.cls, self.equip, self.equip_cls, self.part, self.unit, self.role, self.note)
        r.duplicate_of = self
        r.exact_duplicate = exact
        return r


def add_note(row, text):
    row.note = text if not row.note else row.note + "; " + text


# ---------------------------------------------------------------- FCUs, older contract
def older_fcu(floor, seq):
    eq = f"FCU-{floor:02d}-{seq:02d}"
    dev = 10000 + floor * 100 + seq
    pre = f"WCH_L{floor:02d}_FC{seq:02d}_"
    d = f"FCU {floor}-{seq:02d}"
    # floor 4 controllers run a firmware that writes the unit as degF
    degf = "degF" if floor == 4 else "°F"
    fcu = dict(equip=eq, equip_cls="Fan_Coil_Unit")
    pts = [
        ("zat", "RMTMP", f"{d} ROOM TEMP", degf, "AI", True,
         dict(cls="Zone_Air_Temperature_Sensor", unit="DEG_F", role="zone_air_temperature")),
        ("dat", "DISTMP", f"{d} DISCH AIR TEMP", degf, "AI", True,
         dict(cls="Discharge_Air_Temperature_Sensor", unit="DEG_F", role="discharge_air_temperature")),
        ("clg", "CLGVLV", f"{d} CLG VALVE", "%", "AO", True,
         dict(cls="Valve_Position_Command", part="Chilled_Water_Valve", unit="PERCENT",
              role="cooling_valve_command")),
        ("htg", "HTGVLV", f"{d} HTG VALVE", "%", "AO", True,
         dict(cls="Valve_Position_Command", part="Hot_Water_Valve", unit="PERCENT",
              role="heating_valve_command")),
        ("fst", "FANPRF", f"{d} FAN PROOF", "", "BI", True,
         dict(cls="Fan_Status", role="fan_status")),
        ("fss", "FANSS", f"{d} FAN START/STOP", "", "BO", False,
         dict(cls="Start_Stop_Command")),
        ("fsp", "FANSPD", f"{d} FAN SPEED (OFF,LOW,MED,HIGH)", "", "MSV", True,
         dict(cls="Fan_Speed_Command", note="3-speed fan stage, multistate")),
        ("occ", "OCCMD", f"{d} OCC MODE", "", "BV", True,
         dict(cls="Occupancy_Command", role="occupancy")),
        ("zsp", "RMSTPT", f"{d} ROOM SETPOINT", degf, "AV", True,
         dict(cls="Target_Zone_Air_Temperature_Setpoint", unit="DEG_F",
              role="zone_temperature_setpoint")),
        ("flt", "FLTALM", f"{d} FILTER ALARM", "", "BI", False,
         dict(cls="Filter_Status")),
    ]
    return build_fcu_rows(eq, pre, dev, pts, fcu)


# ---------------------------------------------------------------- FCUs, newer contract
def newer_fcu(floor, seq):
    eq = f"FCU-{floor:02d}-{seq:02d}"
    dev = 20000 + floor * 100 + seq
    pre = f"WCH.LV{floor:02d}.FC{floor:02d}{seq:02d}."
    d = eq
    zone_type = "AV" if floor in AV_ZONE_SENSOR_FLOORS else "AI"
    fcu = dict(equip=eq, equip_cls="Fan_Coil_Unit")
    zat_extra = dict(cls="Zone_Air_Temperature_Sensor", unit="DEG_C", role="zone_air_temperature")
    if zone_type == "AV":
        zat_extra["note"] = "AV: networked wall sensor"
    pts = [
        ("zat", "Zone.Temp", f"{d} Zone Temperature", "°C", zone_type, True, zat_extra),
        ("dat", "Disch.Temp", f"{d} Discharge Air Temperature", "°C", "AI", True,
         dict(cls="Discharge_Air_Temperature_Sensor", unit="DEG_C", role="discharge_air_temperature")),
        ("clg", "ChwVlv.Cmd", f"{d} Chilled Water Valve Command", "%", "AO", True,
         dict(cls="Valve_Position_Command", part="Chilled_Water_Valve", unit="PERCENT",
              role="cooling_valve_command")),
        ("htg", "HwVlv.Cmd", f"{d} Heating Valve Command", "%", "AO", True,
         dict(cls="Valve_Position_Command", part="Hot_Water_Valve", unit="PERCENT",
              role="heating_valve_command")),
        ("fst", "Fan.Status", f"{d} Fan Status", "", "BI", True,
         dict(cls="Fan_Status", role="fan_status")),
        ("fss", "Fan.Cmd", f"{d} Fan Start Stop", "", "BO", False,
         dict(cls="Start_Stop_Command")),
        ("fsp", "Fan.SpeedCmd", f"{d} ECM Fan Speed Command", "%", "AO", True,
         dict(cls="Fan_Speed_Command", unit="PERCENT")),
        ("occ", "Occ.Mode", f"{d} Occupancy Mode", "", "BV", True,
         dict(cls="Occupancy_Command", role="occupancy")),
        ("zsp", "Zone.Setpt", f"{d} Zone Setpoint", "°C", "AV", True,
         dict(cls="Target_Zone_Air_Temperature_Setpoint", unit="DEG_C",
              role="zone_temperature_setpoint")),
        ("csp", "Zone.EffClgSetpt", f"{d} Effective Cooling Setpoint", "°C", "AV", True,
         dict(cls="Effective_Cooling_Zone_Air_Temperature_Setpoint", unit="DEG_C",
              note="effective cooling setpoint; no tufa role")),
        ("hsp", "Zone.EffHtgSetpt", f"{d} Effective Heating Setpoint", "°C", "AV", True,
         dict(cls="Effective_Heating_Zone_Air_Temperature_Setpoint", unit="DEG_C",
              note="effective heating setpoint; no tufa role")),
    ]
    return build_fcu_rows(eq, pre, dev, pts, fcu)


def build_fcu_rows(eq, pre, dev, pts, fcu):
    rows = []
    for kind, token, desc, units, otype, trended, key in pts:
        if kind == "dat" and eq in NO_DISCHARGE_SENSOR:
            continue
        if kind == "clg" and NO_VALVE.get(eq) == "cooling":
            continue
        if kind == "htg" and NO_VALVE.get(eq) == "heating":
            continue
        name_token = NAME_MISSPELLINGS.get((eq, kind), token)
        row = Row(pre + name_token, DESC_MISSPELLINGS.get((eq, kind), desc), units, otype, dev,
                  trended, **fcu, **key)
        if name_token != token:
            add_note(row, f"misspelt: {name_token} for {token}")
        if (eq, kind) in DESC_MISSPELLINGS:
            add_note(row, f"misspelt description: {row.desc}")
        if (eq, kind) in EMPTY_UNIT:
            row.units = ""
            add_note(row, f"units column empty; rule file sets {row.unit}")
        rows.append(row)
    return rows


def fcu_spare(eq, dev, pre, token, otype, desc):
    return Row(pre + token, desc, "", otype, dev, False,
               note=f"spare I/O on the {eq} controller; maps to nothing")


# ---------------------------------------------------------------- air handlers
def older_ahu(n, dev, serves):
    eq = f"AHU-{n}"
    pre = f"WCH_AHU{n}_"
    d = f"AHU {n}"
    a = dict(equip=eq, equip_cls="Air_Handling_Unit")
    spec = [
        ("sat", "SATMP", f"{d} SUPPLY AIR TEMP", "°F", "AI", True,
         dict(cls="Supply_Air_Temperature_Sensor", unit="DEG_F", role="discharge_air_temperature")),
        ("rat", "RATMP", f"{d} RETURN AIR TEMP", "°F", "AI", True,
         dict(cls="Return_Air_Temperature_Sensor", unit="DEG_F")),
        ("mat", "MATMP", f"{d} MIXED AIR TEMP", "°F", "AI", True,
         dict(cls="Mixed_Air_Temperature_Sensor", unit="DEG_F")),
        ("oat", "OATMP", f"{d} OUTSIDE AIR TEMP", "°F", "AI", True,
         dict(cls="Outside_Air_Temperature_Sensor", unit="DEG_F",
              note="AHU intake sensor; the building reference is the roof sensor")),
        ("sasp", "SATSP", f"{d} SUPPLY AIR TEMP SETPOINT", "°F", "AV", True,
         dict(cls="Supply_Air_Temperature_Setpoint", unit="DEG_F")),
        ("sfs", "SF_STS", f"{d} SUPPLY FAN STATUS", "", "BI", True,
         dict(cls="Fan_Status", role="fan_status", note="supply fan")),
        ("sfc", "SF_SS", f"{d} SUPPLY FAN START/STOP", "", "BO", True,
         dict(cls="Start_Stop_Command", note="supply fan")),
        ("sfv", "SF_VFD", f"{d} SUPPLY FAN SPEED", "%", "AO", True,
         dict(cls="Fan_Speed_Command", unit="PERCENT", note="supply fan")),
        ("dsp", "DSP", f"{d} DUCT STATIC PRESSURE", "in. WC", "AI", True,
         dict(cls="Supply_Air_Static_Pressure_Sensor", unit="IN_H2O",
              note="SP here is static pressure, not a setpoint")),
        ("dspsp", "DSPSP", f"{d} DUCT STATIC SETPOINT", "in. WC", "AV", True,
         dict(cls="Supply_Air_Static_Pressure_Setpoint", unit="IN_H2O")),
        ("clg", "CLGVLV", f"{d} CLG VALVE", "%", "AO", True,
         dict(cls="Valve_Position_Command", part="Chilled_Water_Valve", unit="PERCENT",
              role="cooling_valve_command")),
        ("htg", "HTGVLV", f"{d} HTG VALVE", "%", "AO", True,
         dict(cls="Valve_Position_Command", part="Hot_Water_Valve", unit="PERCENT",
              role="heating_valve_command")),
        ("oad", "OADMPR", f"{d} OA DAMPER", "%", "AO", True,
         dict(cls="Damper_Position_Command", unit="PERCENT", note="outdoor air damper")),
        ("rad", "RADMPR", f"{d} RA DAMPER", "%", "AO", True,
         dict(cls="Damper_Position_Command", unit="PERCENT", note="return air damper")),
    ]
    rows = []
    for kind, token, desc, units, otype, trended, key in spec:
        row = Row(pre + token, DESC_MISSPELLINGS.get((eq, kind), desc), units, otype, dev,
                  trended, **a, **key)
        if (eq, kind) in DESC_MISSPELLINGS:
            add_note(row, f"misspelt description: {row.desc}")
        if kind == "sat":
            add_note(row, f"serves {serves}")
        rows.append(row)
    return rows


def newer_ahu(n, dev, serves):
    eq = f"AHU-{n}"
    pre = f"WCH.AHU{n}."
    d = f"AHU-{n}"
    a = dict(equip=eq, equip_cls="Air_Handling_Unit")
    spec = [
        ("sat", "SupplyAir.Temp", f"{d} Supply Air Temperature", "°C", "AI",
         dict(cls="Supply_Air_Temperature_Sensor", unit="DEG_C", role="discharge_air_temperature",
              note=f"serves {serves}")),
        ("rat", "ReturnAir.Temp", f"{d} Return Air Temperature", "°C", "AI",
         dict(cls="Return_Air_Temperature_Sensor", unit="DEG_C")),
        ("mat", "MixedAir.Temp", f"{d} Mixed Air Temperature", "°C", "AI",
         dict(cls="Mixed_Air_Temperature_Sensor", unit="DEG_C")),
        ("oat", "OutdoorAir.Temp", f"{d} Outdoor Air Temperature", "°C", "AI",
         dict(cls="Outside_Air_Temperature_Sensor", unit="DEG_C",
              note="AHU intake sensor; the building reference is the roof sensor")),
        ("sasp", "SupplyAir.TempSetpt", f"{d} Supply Air Temperature Setpoint", "°C", "AV",
         dict(cls="Supply_Air_Temperature_Setpoint", unit="DEG_C")),
        ("sfs", "SupplyFan.Status", f"{d} Supply Fan Status", "", "BI",
         dict(cls="Fan_Status", role="fan_status", note="supply fan")),
        ("sfc", "SupplyFan.Cmd", f"{d} Supply Fan Start Stop", "", "BO",
         dict(cls="Start_Stop_Command", note="supply fan")),
        ("sfv", "SupplyFan.SpeedCmd", f"{d} Supply Fan VFD Speed", "%", "AO",
         dict(cls="Fan_Speed_Command", unit="PERCENT", note="supply fan")),
        ("dsp", "SupplyAir.StaticPress", f"{d} Supply Duct Static Pressure", "Pa", "AI",
         dict(cls="Supply_Air_Static_Pressure_Sensor", unit="PA")),
        ("dspsp", "SupplyAir.StaticPressSetpt", f"{d} Supply Duct Static Pressure Setpoint", "Pa",
         "AV", dict(cls="Supply_Air_Static_Pressure_Setpoint", unit="PA")),
        ("clg", "ChwVlv.Cmd", f"{d} Chilled Water Valve Command", "%", "AO",
         dict(cls="Valve_Position_Command", part="Chilled_Water_Valve", unit="PERCENT",
              role="cooling_valve_command")),
        ("htg", "HwVlv.Cmd", f"{d} Hot Water Valve Command", "%", "AO",
         dict(cls="Valve_Position_Command", part="Hot_Water_Valve", unit="PERCENT",
              role="heating_valve_command")),
        ("oad", "OutdoorAirDmpr.Cmd", f"{d} Outdoor Air Damper Command", "%", "AO",
         dict(cls="Damper_Position_Command", unit="PERCENT", note="outdoor air damper")),
        ("rad", "ReturnAirDmpr.Cmd", f"{d} Return Air Damper Command", "%", "AO",
         dict(cls="Damper_Position_Command", unit="PERCENT", note="return air damper")),
    ]
    return [Row(pre + token, desc, units, otype, dev, True, **a, **key)
            for kind, token, desc, units, otype, key in spec]


# ---------------------------------------------------------------- plant, weather, meters
def hw_loop(dev):
    a = dict(equip="HW-LOOP", equip_cls="Hot_Water_Loop")
    return [
        Row("WCH_HW_SUPTMP", "HW SUPPLY TEMP", "°F", "AI", dev, True, **a,
            cls="Leaving_Hot_Water_Temperature_Sensor", unit="DEG_F",
            role="hot_water_supply_temperature", note="Brick 1.3+ calls supply 'leaving'"),
        Row("WCH_HW_RETTMP", "HW RETURN TEMP", "°F", "AI", dev, True, **a,
            cls="Entering_Hot_Water_Temperature_Sensor", unit="DEG_F",
            note="Brick 1.3+ calls return 'entering'"),
        Row("WCH_HW_SUPSP", "HW SUPPLY TEMP SETPOINT", "°F", "AV", dev, True, **a,
            cls="Leaving_Hot_Water_Temperature_Setpoint", unit="DEG_F"),
        Row("WCH_HW_DP", "HW LOOP DIFF PRESSURE", "psi", "AI", dev, True, **a,
            cls="Hot_Water_Differential_Pressure_Sensor", unit="PSI"),
        Row("WCH_HWP1_STS", "HW PUMP 1 STATUS", "", "BI", dev, True, **a,
            cls="Pump_Status", note="pump HWP-1"),
        Row("WCH_HWP2_STS", "HW PUMP 2 STATUS", "", "BI", dev, True, **a,
            cls="Pump_Status", note="pump HWP-2"),
    ]


def chw_loop(dev):
    a = dict(equip="CHW-LOOP", equip_cls="Chilled_Water_Loop")
    rows = [
        Row("WCH.PLANT.CHW.Supply.Temp", "Chilled Water Supply Temperature", "°C", "AI", dev, True,
            **a, cls="Leaving_Chilled_Water_Temperature_Sensor", unit="DEG_C",
            role="chilled_water_supply_temperature", note="Brick 1.3+ calls supply 'leaving'"),
        Row("WCH.PLANT.CHW.Return.Temp", "Chilled Water Return Temperature", "°C", "AI", dev, True,
            **a, cls="Entering_Chilled_Water_Temperature_Sensor", unit="DEG_C",
            note="Brick 1.3+ calls return 'entering'"),
        Row("WCH.PLANT.CHW.Supply.TempSetpt", "Chilled Water Supply Temperature Setpoint", "°C",
            "AV", dev, True, **a, cls="Leaving_Chilled_Water_Temperature_Setpoint", unit="DEG_C"),
        Row("WCH.PLANT.CHW.Loop.DiffPress", "Chilled Water Loop Differential Pressure", "kPa",
            "AI", dev, True, **a, cls="Chilled_Water_Differential_Pressure_Sensor", unit="KiloPA"),
        Row("WCH.PLANT.CHWP1.Status", "Chilled Water Pump 1 Status", "", "BI", dev, True, **a,
            cls="Pump_Status", note="pump CHWP-1"),
        Row("WCH.PLANT.CHWP2.Status", "Chilled Water Pump 2 Status", "", "BI", dev, True, **a,
            cls="Pump_Status", note="pump CHWP-2"),
    ]
    for row in rows:
        if ("CHW-LOOP", "dp") in EMPTY_UNIT and row.name.endswith(".Loop.DiffPress"):
            row.units = ""
            add_note(row, f"units column empty; rule file sets {row.unit}")
    return rows


def weather(dev):
    return [
        Row("WCH.ROOF.WX.OutdoorAir.Temp", "Roof Outdoor Air Temperature", "°C", "AI", dev, True,
            cls="Outside_Air_Temperature_Sensor", unit="DEG_C", role="outdoor_air_temperature",
            note="building-level sensor, no equipment"),
        Row("WCH.ROOF.WX.OutdoorAir.Humidity", "Roof Outdoor Air Relative Humidity", "%RH", "AI",
            dev, True, cls="Outside_Air_Humidity_Sensor", unit="PERCENT_RH",
            note="building-level sensor, no equipment"),
    ]


def meters(dev_new, dev_old):
    def m(name, desc, units, equip, equip_cls, cls, unit, dev, note=""):
        return Row(name, desc, units, "AI", dev, True, cls=cls, equip=equip, equip_cls=equip_cls,
                   unit=unit, note=note)
    return [
        m("WCH.MTR.ElecMain.Demand", "Main Electric Service Demand", "kW", "METER-ELEC-MAIN",
          "Building_Electrical_Meter", "Electric_Power_Sensor", "KiloW", dev_new),
        m("WCH.MTR.ElecMain.Energy", "Main Electric Service Energy", "kWh", "METER-ELEC-MAIN",
          "Building_Electrical_Meter", "Electric_Energy_Sensor", "KiloW-HR", dev_new),
        m("WCH.MTR.ElecRetail.Demand", "Retail Sub-meter Demand", "kW", "METER-ELEC-RETAIL",
          "Electrical_Meter", "Electric_Power_Sensor", "KiloW", dev_new,
          "sub-meter of METER-ELEC-MAIN"),
        m("WCH.MTR.ElecRetail.Energy", "Retail Sub-meter Energy", "kWh", "METER-ELEC-RETAIL",
          "Electrical_Meter", "Electric_Energy_Sensor", "KiloW-HR", dev_new,
          "sub-meter of METER-ELEC-MAIN"),
        m("WCH.MTR.ChwBtu.Power", "Chilled Water Thermal Power", "kW", "METER-CHW",
          "Chilled_Water_Meter", "Thermal_Power_Sensor", "KiloW", dev_new),
        m("WCH.MTR.ChwBtu.Energy", "Chilled Water Thermal Energy", "MWh", "METER-CHW",
          "Chilled_Water_Meter", "Energy_Sensor", "MegaW-HR", dev_new,
          "cumulative thermal energy"),
        m("WCH_MTR_HW_KW", "HW BTU METER POWER", "kW", "METER-HW",
          "Hot_Water_Meter", "Thermal_Power_Sensor", "KiloW", dev_old),
        m("WCH_MTR_HW_MWH", "HW BTU METER ENERGY", "MWh", "METER-HW",
          "Hot_Water_Meter", "Energy_Sensor", "MegaW-HR", dev_old, "cumulative thermal energy"),
    ]


# ---------------------------------------------------------------- the Ropewalk wing (VAV boxes)
def wing_box(floor, seat):
    eq = f"RW-VAV-{floor}-{seat:02d}"
    dev = 40000 + floor * 100 + seat
    pre = f"WCH-RW/L{floor}/VAV-{floor}.{seat:02d}/"
    reheat = seat in WING_REHEAT_SEATS
    d = f"Ropewalk L{floor} VAV {floor}.{seat:02d}"
    box = dict(equip=eq, equip_cls="Variable_Air_Volume_Box_With_Reheat" if reheat
               else "Variable_Air_Volume_Box")
    flow_units, flow_unit = ("cfm", "FT3-PER-MIN") if floor in WING_CFM_FLOORS else ("L/s", "L-PER-SEC")
    pts = [
        ("zat", "ZN-T", f"{d} Zone Temp", "°C", "AI", True,
         dict(cls="Zone_Air_Temperature_Sensor", unit="DEG_C", role="zone_air_temperature")),
        ("dat", "DA-T", f"{d} Discharge Air Temp", "°C", "AI", True,
         dict(cls="Discharge_Air_Temperature_Sensor", unit="DEG_C", role="discharge_air_temperature")),
        ("af", "AF", f"{d} Airflow", flow_units, "AI", True,
         dict(cls="Supply_Air_Flow_Sensor", unit=flow_unit, role="airflow")),
        ("afsp", "AF-SP", f"{d} Airflow Setpoint", flow_units, "AV", True,
         dict(cls="Supply_Air_Flow_Setpoint", unit=flow_unit, role="airflow_setpoint")),
        ("afmin", "AF-MIN", f"{d} Minimum Airflow", flow_units, "AV", False,
         dict(cls="Min_Air_Flow_Setpoint_Limit", unit=flow_unit, note="configuration, not trended")),
        ("afmax", "AF-MAX", f"{d} Maximum Airflow", flow_units, "AV", False,
         dict(cls="Max_Air_Flow_Setpoint_Limit", unit=flow_unit, note="configuration, not trended")),
        ("dcmd", "DMP-CMD", f"{d} Damper Command", "%", "AO", True,
         dict(cls="Damper_Position_Command", part="Damper", unit="PERCENT", role="damper_command")),
        ("dpos", "DMP-POS", f"{d} Damper Position", "%", "AI", True,
         dict(cls="Damper_Position_Sensor", part="Damper", unit="PERCENT", role="damper_position")),
        ("rhv", "RHV-CMD", f"{d} Reheat Valve Command", "%", "AO", True,
         dict(cls="Valve_Position_Command", part="Reheat_Valve", unit="PERCENT", role="reheat_valve_command")),
        ("csp", "CLG-SP", f"{d} Effective Cooling Setpoint", "°C", "AV", True,
         dict(cls="Effective_Cooling_Zone_Air_Temperature_Setpoint", unit="DEG_C",
              role="zone_cooling_temperature_setpoint")),
        ("hsp", "HTG-SP", f"{d} Effective Heating Setpoint", "°C", "AV", True,
         dict(cls="Effective_Heating_Zone_Air_Temperature_Setpoint", unit="DEG_C",
              role="zone_heating_temperature_setpoint")),
        ("occ", "OCC", f"{d} Occupancy Mode", "", "BV", True,
         dict(cls="Occupancy_Command", role="occupancy")),
    ]
    rows = []
    for kind, token, desc, units, otype, trended, key in pts:
        if kind == "dat" and eq in WING_NO_DISCHARGE:
            continue
        if kind == "dpos" and floor not in WING_FEEDBACK_FLOORS:
            continue
        if kind == "rhv" and not reheat:
            continue
        name_token = WING_NAME_MISSPELLINGS.get((eq, kind), token)
        row = Row(pre + name_token, desc, units, otype, dev, trended, **box, **key)
        if name_token != token:
            add_note(row, f"misspelt: {name_token} for {token}")
        if kind in ("af", "afsp", "afmin", "afmax") and floor in WING_CFM_FLOORS:
            add_note(row, "airflow in cfm (balancing contractor's setting)")
        rows.append(row)
    return rows


def wing_ahu(dev):
    eq = "AHU-4"
    pre = "WCH-RW/AHU-4/"
    a = dict(equip=eq, equip_cls="Air_Handling_Unit")
    spec = [
        ("SA-T", "AHU-4 Supply Air Temp", "°C", "AI",
         dict(cls="Supply_Air_Temperature_Sensor", unit="DEG_C", role="ahu_supply_air_temperature",
              note="serves the Ropewalk wing VAV boxes")),
        ("SA-T-STPT", "AHU-4 Supply Air Temp Setpoint", "°C", "AV",
         dict(cls="Supply_Air_Temperature_Setpoint", unit="DEG_C")),
        ("SA-P", "AHU-4 Supply Duct Static Pressure", "Pa", "AI",
         dict(cls="Supply_Air_Static_Pressure_Sensor", unit="PA", role="ahu_supply_static_pressure")),
        ("SA-P-STPT", "AHU-4 Supply Duct Static Pressure Setpoint", "Pa", "AV",
         dict(cls="Supply_Air_Static_Pressure_Setpoint", unit="PA")),
        ("SF-STS", "AHU-4 Supply Fan Status", "", "BI",
         dict(cls="Fan_Status", note="supply fan")),
        ("SF-SPD", "AHU-4 Supply Fan Speed", "%", "AO",
         dict(cls="Fan_Speed_Command", unit="PERCENT", note="supply fan")),
    ]
    return [Row(pre + token, desc, units, otype, dev, True, **a, **key)
            for token, desc, units, otype, key in spec]


def bare_spare(name, otype, dev, desc="Spare"):
    return Row(name, desc, "", otype, dev, False, note="spare; maps to nothing")


# ---------------------------------------------------------------- assembly
def build(rng):
    devices = []   # one list of rows per controller, in export order

    # spare I/O on FCU controllers: equipment -> (token, object type)
    older_spares = {"FCU-01-03": ("SPARE_AI3", "AI"), "FCU-01-08": ("SPARE_BO2", "BO"),
                    "FCU-03-10": ("SPARE_AO2", "AO"), "FCU-05-02": ("SPARE_BO1", "BO"),
                    "FCU-06-09": ("SPARE_AI3", "AI")}
    newer_spares = {"FCU-07-04": ("Spare.AI2", "AI"), "FCU-09-11": ("Spare.BO1", "BO"),
                    "FCU-11-01": ("Spare.AO3", "AO"), "FCU-12-13": ("Spare.AI2", "AI")}

    # ---- older contract devices (1xxxx): FCUs, AHU-1, AHU-2, HW plant, HW meter
    for floor in OLDER_FLOORS:
        for seq in range(1, FCUS_PER_FLOOR[floor] + 1):
            eq = f"FCU-{floor:02d}-{seq:02d}"
            rows = older_fcu(floor, seq)
            if eq in older_spares:
                token, otype = older_spares[eq]
                rows.append(fcu_spare(eq, rows[0].device, f"WCH_L{floor:02d}_FC{seq:02d}_",
                                      token, otype, "SPARE"))
            devices.append(rows)
    ahu1 = older_ahu(1, 10901, "ground-floor retail (level 1)")
    ahu1.append(bare_spare("SPARE_AI_3", "AI", 10901))
    ahu1.append(Row("WCH_AHU1_HUMCMD", "AHU 1 HUMIDIFIER CMD - NOT USED", "%", "AO", 10901, False,
                    note="unused output (humidifier removed); maps to nothing"))
    devices.append(ahu1)
    ahu2 = older_ahu(2, 10902, "office levels 2-6")
    ahu2.append(bare_spare("SPARE_BI_5", "BI", 10902))
    devices.append(ahu2)
    hw = hw_loop(10950)
    hw.append(bare_spare("SPARE_AO_4", "AO", 10950))
    devices.append(hw)

    # ---- newer contract devices (2xxxx): FCUs, AHU-3, CHW plant, weather
    for floor in NEWER_FLOORS:
        for seq in range(1, FCUS_PER_FLOOR[floor] + 1):
            eq = f"FCU-{floor:02d}-{seq:02d}"
            rows = newer_fcu(floor, seq)
            if eq in newer_spares:
                token, otype = newer_spares[eq]
                rows.append(fcu_spare(eq, rows[0].device,
                                      f"WCH.LV{floor:02d}.FC{floor:02d}{seq:02d}.",
                                      token, otype, "Unused point"))
            devices.append(rows)
    ahu3 = newer_ahu(3, 20903, "office levels 7-12")
    ahu3.append(bare_spare("WCH.AHU3.Spare.AI6", "AI", 20903, "Unused point"))
    ahu3.append(bare_spare("WCH.AHU3.Spare.BO4", "BO", 20903, "Unused point"))
    devices.append(ahu3)
    chw = chw_loop(20950)
    chw.append(bare_spare("WCH.PLANT.Spare.AI9", "AI", 20950, "Unused point"))
    chw.append(bare_spare("WCH.PLANT.Spare.AO5", "AO", 20950, "Unused point"))
    devices.append(chw)
    devices.append(weather(20960))

    # ---- meter gateway (3xxxx): mixed naming (electric + CHW renamed in 2021, HW kept)
    mt = meters(30001, 30001)
    for i in range(1, 5):
        mt.append(bare_spare(f"SPARE_AV_{i}", "AV", 30001))
    devices.append(mt)

    rows = [r for dev_rows in devices for r in dev_rows]

    # ---- a few FCU temperatures whose unit another tool wrote with a space ("deg F")
    for written, shown in (("deg F", "°F"), ("deg C", "°C")):
        eligible = [r for r in rows
                    if r.equip_cls == "Fan_Coil_Unit" and r.units == shown and not r.note]
        for r in rng.sample(eligible, UNIT_VARIANTS_PER_CONVENTION):
            r.units = written
            add_note(r, f"unit written as {written}")

    # ---- duplicates: two exact repeats right after the original (export glitch) and two
    # points listed again at the end under a second trend log (same name, new trend id)
    adjacent = ["WCH_L03_FC05_RMTMP", "WCH.LV10.FC1002.Fan.Status"]
    again_at_end = ["WCH_L05_FC12_CLGVLV", "WCH.LV11.FC1107.Zone.Temp"]
    out = []
    for r in rows:
        out.append(r)
        if r.name in adjacent:
            out.append(r.duplicate(exact=True))
    for name in again_at_end:
        out.append(next(r for r in rows if r.name == name).duplicate(exact=False))

    # ---- the Ropewalk wing, exported last (its own contract, 2028): the lines above keep their numbers
    out.extend(wing_ahu(40904))
    for floor in WING_FLOORS:
        for seat in range(1, WING_BOXES_PER_FLOOR + 1):
            out.extend(wing_box(floor, seat))

    # ---- trend ids: older-contract devices (< 20000) TL-<device>-<n>, the others numeric
    per_device = {}
    next_numeric = 400101
    line_of = {}
    for idx, r in enumerate(out):
        if r.duplicate_of is None:
            line_of[id(r)] = idx + 2   # header is line 1
        else:
            add_note(r, f"duplicate of line {line_of[id(r.duplicate_of)]}")
        if r.exact_duplicate:
            r.trend = r.duplicate_of.trend
        elif not r.trended:
            r.trend = ""
        elif r.device < 20000:
            per_device[r.device] = per_device.get(r.device, 0) + 1
            r.trend = f"TL-{r.device}-{per_device[r.device]}"
        elif r.device >= 40000:
            per_device[r.device] = per_device.get(r.device, 0) + 1
            r.trend = f"RW{r.device}.{per_device[r.device]}"
        else:
            r.trend = str(next_numeric)
            next_numeric += 1
    return out


def check(rows):
    """Self-checks: fail loudly rather than write an inconsistent answer key."""
    trend_ids = [r.trend for r in rows if r.trend and not r.exact_duplicate]
    assert len(trend_ids) == len(set(trend_ids)), "trend ids must be unique per point"
    names = {}
    for r in rows:
        names[r.name] = names.get(r.name, 0) + 1
    repeated = sorted(n for n, c in names.items() if c > 1)
    assert repeated == sorted(r.name for r in rows if r.duplicate_of), repeated
    for r in rows:
        w = WING_RE.match(r.name)
        if r.equip_cls.startswith("Variable_Air_Volume_Box"):
            assert w and w.group(1) == w.group(2), r.name
            assert f"RW-VAV-{w.group(2)}-{w.group(3)}" == r.equip, r.name
        m = OLDER_FCU_RE.match(r.name) or NEWER_FCU_RE.match(r.name)
        if r.equip_cls == "Fan_Coil_Unit":
            assert m, r.name
            assert f"FCU-{m.group(1)}-{m.group(2)}" == r.equip, r.name
        if m and r.equip:
            assert r.equip_cls == "Fan_Coil_Unit", r.name
        assert (r.cls == "") == (r.equip == "" and "building-level" not in r.note), r.name
        assert "\n" not in r.name + r.desc and "," not in r.name, r.name
        assert (r.part != "") == (r.role in ("cooling_valve_command", "heating_valve_command", "damper_command",
                                             "damper_position", "reheat_valve_command")), r.name
        assert r.otype in ("AI", "AO", "AV", "BI", "BO", "BV", "MSV"), r.name
        assert (r.unit == "") == (r.otype in ("BI", "BO", "BV", "MSV") or r.cls == ""), r.name


def to_csv(header, records):
    buf = io.StringIO()
    w = csv.writer(buf, lineterminator="\n", quoting=csv.QUOTE_MINIMAL)
    w.writerow(header)
    w.writerows(records)
    return buf.getvalue().encode("utf-8")


def summarise(rows):
    def names(pred, fmt=lambda r: f"`{r.name}`"):
        return "; ".join(fmt(r) for r in rows if pred(r)) or "none"

    fcus = OrderedDict()
    for r in rows:
        if r.equip_cls == "Fan_Coil_Unit":
            fcus.setdefault(r.equip, None)
    per_floor = OrderedDict((f, 0) for f in FCUS_PER_FLOOR)
    for eq in fcus:
        per_floor[int(eq[4:6])] += 1
    older = sum(1 for r in rows if r.name.startswith("WCH_") or r.name.startswith("SPARE_"))
    spares = [r for r in rows if "maps to nothing" in r.note]
    wing_boxes = OrderedDict()
    for r in rows:
        if r.equip_cls.startswith("Variable_Air_Volume_Box"):
            wing_boxes.setdefault(r.equip, r.equip_cls)
    wing_reheat = sum(1 for c in wing_boxes.values() if c.endswith("With_Reheat"))
    wing_rows = sum(1 for r in rows if r.name.startswith("WCH-RW/"))
    lines = [
        "### Summary (printed by make_points.py)",
        "",
        f"- Rows: {len(rows)} data rows plus the header; FCUs: {len(fcus)}; "
        f"rows with an empty trend id: {sum(1 for r in rows if not r.trend)}",
        "- FCUs per floor: " + ", ".join(f"L{f:02d} {n}" for f, n in per_floor.items()),
        f"- Rows per convention: older underscore {older} (bare `SPARE_…` names counted here), "
        f"newer dotted {len(rows) - older}",
        "- Units without a discharge-air sensor: " + ", ".join(NO_DISCHARGE_SENSOR),
        "- Units without a valve command: "
        + ", ".join(f"{eq} (no {kind} valve command)" for eq, kind in NO_VALVE.items()),
        "- Misspellings: " + names(lambda r: "misspelt" in r.note,
                                   lambda r: f"`{r.name}` ({r.note.split('; ')[-1]})"),
        "- Empty unit column: " + names(lambda r: "units column empty" in r.note,
                                        lambda r: f"`{r.name}` (expected {r.unit})"),
        "- Temperature unit written with a space: "
        + names(lambda r: "unit written as" in r.note and r.duplicate_of is None,
                lambda r: f"`{r.name}` ({r.units})"),
        "- Floor 4 (older contract) writes `degF` instead of `°F`; floor 12 zone "
        "temperatures are AV (networked wall sensors), not AI",
        "- Duplicates: " + names(lambda r: r.duplicate_of is not None,
                                 lambda r: f"`{r.name}` ({r.note.split('; ')[-1]}, "
                                           + ("exact repeat" if r.exact_duplicate
                                              else f"second trend id {r.trend}") + ")"),
        f"- Spares and unused points ({len(spares)}): "
        + ", ".join(f"`{r.name}` ({r.otype}, device {r.device})" for r in spares),
        f"- Ropewalk wing: {len(wing_boxes)} VAV boxes ({wing_reheat} with hot-water reheat, "
        f"{len(wing_boxes) - wing_reheat} cooling-only) on AHU-4, {wing_rows} rows",
        "- VAV boxes without a discharge-air sensor: " + ", ".join(WING_NO_DISCHARGE),
        "- Damper position feedback only on levels " + ", ".join(str(f) for f in sorted(WING_FEEDBACK_FLOORS))
        + "; level " + ", ".join(str(f) for f in sorted(WING_CFM_FLOORS)) + " airflows in cfm",
    ]
    return "\n".join(lines) + "\n"


def main(argv):
    if len(argv) != 2:
        sys.stderr.write(__doc__)
        return 2
    out_dir = Path(argv[1])
    rng = random.Random(SEED)
    rows = build(rng)
    check(rows)
    out_dir.mkdir(parents=True, exist_ok=True)
    (out_dir / "points.csv").write_bytes(to_csv(
        HEADER, [[r.name, r.desc, r.units, r.otype, str(r.device), r.trend] for r in rows]))
    (out_dir / "answer-key.csv").write_bytes(to_csv(
        KEY_HEADER, [[r.name, r.cls, r.equip, r.equip_cls, r.part, r.unit, r.role, r.note]
                     for r in rows]))
    sys.stdout.write(summarise(rows))
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv))
