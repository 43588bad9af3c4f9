#!/usr/bin/env python3
"""Writes tufa's Brick subset (brick-subset.ttl) from the full published Brick vocabulary.

Why a subset: tufa ships a small, reviewed slice of Brick (terminal units, what feeds them, their points)
so that it starts fast and works offline; users who need every class pass the full file with --vocabulary.
The slice is chosen here (SEEDS); every ancestor, equivalent class and replacement of a chosen class is
added, so rdfs:subClassOf* queries behave exactly as on the full vocabulary for these classes.
The IRIs, parents, tags and deprecations are copied unchanged from Brick (BSD-3-Clause, see NOTICE).

Rerun (Debian: apt-get install python3-rdflib), from the repository root:
    /usr/bin/python3 ontology-extensions/tools/brick_subset.py ../shared/vocab/Brick.ttl \
        ontology-extensions/src/main/resources/org/tufa/ontology/brick-subset.ttl
"""
import sys
from rdflib import Graph, Namespace, URIRef, Literal, RDF, RDFS, OWL
from rdflib.namespace import SKOS

BRICK = Namespace("https://brickschema.org/schema/Brick#")
TAG = Namespace("https://brickschema.org/schema/BrickTag#")
REF = Namespace("https://brickschema.org/schema/Brick/ref#")

SEEDS = """
Fan_Coil_Unit FCU Terminal_Unit Variable_Air_Volume_Box Variable_Air_Volume_Box_With_Reheat
Air_Handling_Unit AHU Rooftop_Unit Chilled_Water_Loop Hot_Water_Loop Water_Loop Chiller Boiler
Chilled_Water_System Hot_Water_System Pump Chilled_Water_Pump Hot_Water_Pump Pump_Status
Valve Chilled_Water_Valve Hot_Water_Valve Heating_Valve Cooling_Valve Reheat_Valve
Fan Supply_Fan Return_Fan Exhaust_Fan Damper Outside_Damper
Meter Electrical_Meter Building_Electrical_Meter Thermal_Power_Meter Chilled_Water_Meter Hot_Water_Meter Water_Meter
Building Floor Room HVAC_Zone Zone Site Space
Zone_Air_Temperature_Sensor Discharge_Air_Temperature_Sensor Supply_Air_Temperature_Sensor
Return_Air_Temperature_Sensor Mixed_Air_Temperature_Sensor Outside_Air_Temperature_Sensor
Zone_Air_Humidity_Sensor Outside_Air_Humidity_Sensor Zone_Air_Temperature_Setpoint Target_Zone_Air_Temperature_Setpoint
Cooling_Zone_Air_Temperature_Setpoint Heating_Zone_Air_Temperature_Setpoint
Zone_Air_Cooling_Temperature_Setpoint Zone_Air_Heating_Temperature_Setpoint
Occupied_Cooling_Temperature_Setpoint Occupied_Heating_Temperature_Setpoint
Unoccupied_Cooling_Temperature_Setpoint Unoccupied_Heating_Temperature_Setpoint
Effective_Air_Temperature_Cooling_Setpoint Effective_Air_Temperature_Heating_Setpoint
Discharge_Air_Temperature_Setpoint Supply_Air_Temperature_Setpoint
Temperature_Sensor Temperature_Setpoint Air_Temperature_Sensor
Valve_Command Valve_Position_Command Valve_Position_Sensor Valve_Status

Damper_Position_Command Damper_Position_Sensor
Fan_Status Fan_Speed_Command Speed_Status Speed_Mode_Status Fan_On_Off_Status Fan_Command
Start_Stop_Command Run_Status On_Off_Command On_Off_Status Enable_Command Mode_Command Mode_Status
Occupancy_Sensor Occupancy_Status Occupancy_Command Occupied_Mode_Status
Air_Flow_Sensor Supply_Air_Flow_Sensor Discharge_Air_Flow_Sensor Air_Flow_Setpoint
Discharge_Air_Flow_Setpoint Supply_Air_Flow_Setpoint
Chilled_Water_Supply_Temperature_Sensor Leaving_Chilled_Water_Temperature_Sensor
Chilled_Water_Return_Temperature_Sensor Entering_Chilled_Water_Temperature_Sensor
Hot_Water_Supply_Temperature_Sensor Leaving_Hot_Water_Temperature_Sensor
Hot_Water_Return_Temperature_Sensor Entering_Hot_Water_Temperature_Sensor
Leaving_Chilled_Water_Temperature_Setpoint
Leaving_Hot_Water_Temperature_Setpoint
Chilled_Water_Differential_Pressure_Sensor Hot_Water_Differential_Pressure_Sensor
Chilled_Water_Flow_Sensor Hot_Water_Flow_Sensor Water_Flow_Sensor
Supply_Air_Static_Pressure_Sensor Supply_Air_Static_Pressure_Setpoint Static_Pressure_Sensor
Filter_Status Filter_Differential_Pressure_Sensor
Alarm Low_Temperature_Alarm High_Temperature_Alarm Condensate_Leak_Alarm Leak_Alarm Fault_Status
Power_Sensor Electric_Power_Sensor Energy_Sensor Electric_Energy_Sensor Thermal_Power_Sensor
Override_Command Cooling_Command Heating_Command
Point Sensor Setpoint Command Status Parameter
Average_Zone_Air_Temperature_Sensor Chilled_Water_Discharge_Temperature_Sensor Coldest_Zone_Air_Temperature_Sensor
Domestic_Hot_Water_Supply_Temperature_Sensor Effective_Target_Zone_Air_Temperature_Setpoint
Effective_Zone_Air_Temperature_Setpoint Hot_Water_Discharge_Temperature_Sensor Intake_Air_Temperature_Sensor
Leaving_Domestic_Hot_Water_Temperature_Sensor Low_Outside_Air_Temperature_Enable_Differential_Sensor
Motor_Speed_Sensor Occupied_Target_Zone_Air_Temperature_Setpoint Occupied_Zone_Air_Temperaure_Setpoint
Outside_Air_Temperature_Enable_Differential_Sensor Outside_Air_Wet_Bulb_Temperature_Sensor
Preheat_Discharge_Air_Temperature_Sensor Preheat_Supply_Air_Temperature_Sensor Room_Air_Temperature_Sensor
Standby_Target_Zone_Air_Temperature_Setpoint Unoccupied_Target_Zone_Air_Temperature_Setpoint
Unoccupied_Zone_Air_Temperature_Setpoint Warmest_Zone_Air_Temperature_Sensor Weather_Station
Air_Flow_Deadband_Setpoint Bypass_Air_Flow_Sensor Cooling_Discharge_Air_Flow_Setpoint
Cooling_Discharge_Air_Temperature_Deadband_Setpoint Cooling_Supply_Air_Flow_Setpoint
Cooling_Supply_Air_Temperature_Deadband_Setpoint Damper_Position_Setpoint Discharge_Air_Temperature_Cooling_Setpoint
Discharge_Air_Temperature_Heating_Setpoint Exhaust_Air_Flow_Sensor Exhaust_Air_Flow_Setpoint Exhaust_Air_Stack_Flow_Sensor
Exhaust_Air_Stack_Flow_Setpoint Fume_Hood_Air_Flow_Sensor Heating_Discharge_Air_Flow_Setpoint
Heating_Discharge_Air_Temperature_Deadband_Setpoint Heating_Supply_Air_Flow_Setpoint
Heating_Supply_Air_Temperature_Deadband_Setpoint Hot_Water_Coil Mixed_Air_Flow_Sensor
Occupied_Air_Temperature_Cooling_Setpoint Occupied_Air_Temperature_Heating_Setpoint
Occupied_Cooling_Temperature_Deadband_Setpoint Occupied_Cooling_Zone_Air_Temperature_Setpoint
Occupied_Discharge_Air_Flow_Setpoint Occupied_Heating_Temperature_Deadband_Setpoint
Occupied_Heating_Zone_Air_Temperature_Setpoint Occupied_Supply_Air_Flow_Setpoint
Open_Heating_Valve_Outside_Air_Temperature_Setpoint Outside_Air_Flow_Sensor Outside_Air_Flow_Setpoint Reheat_Command
Return_Air_Flow_Sensor Stage_Enable_Command Stages_Status Standby_Cooling_Zone_Air_Temperature_Setpoint
Standby_Heating_Zone_Air_Temperature_Setpoint Supply_Air_Temperature_Cooling_Setpoint
Supply_Air_Temperature_Heating_Setpoint Unoccupied_Air_Temperature_Cooling_Setpoint
Unoccupied_Air_Temperature_Heating_Setpoint Unoccupied_Cooling_Temperature_Deadband_Setpoint
Unoccupied_Cooling_Zone_Air_Temperature_Setpoint Unoccupied_Discharge_Air_Flow_Setpoint
Unoccupied_Heating_Temperature_Deadband_Setpoint Unoccupied_Heating_Zone_Air_Temperature_Setpoint
Unoccupied_Supply_Air_Flow_Setpoint
Booster_Fan Zone_Damper Isolation_Damper Discharge_Air_Flow_Demand_Setpoint Supply_Air_Flow_Demand_Setpoint
Average_Discharge_Air_Flow_Sensor Average_Supply_Air_Flow_Sensor Min_Air_Flow_Setpoint_Limit Max_Air_Flow_Setpoint_Limit
Heating_Valve Chilled_Water_Coil Cooling_Coil Heating_Coil
""".split()

RELATIONS = ["hasPoint", "isPointOf", "hasPart", "isPartOf", "feeds", "isFedBy",
             "hasLocation", "isLocationOf", "hasUnit", "value", "hasTag", "hasAssociatedTag",
             "isAssociatedWith", "isReplacedBy", "deprecatedInVersion", "deprecationMitigationMessage"]

CLASS_PREDICATES = [RDFS.subClassOf, OWL.equivalentClass, BRICK.hasAssociatedTag, OWL.deprecated,
                    BRICK.isReplacedBy, BRICK.deprecatedInVersion, SKOS.definition, RDFS.label]


def main(src, dst):
    full = Graph()
    full.parse(src, format="turtle")
    wanted, queue, missing = set(), [BRICK[s] for s in SEEDS], []
    while queue:
        c = queue.pop()
        if c in wanted or not str(c).startswith(str(BRICK)):
            continue
        if (c, RDF.type, OWL.Class) not in full:
            missing.append(c)
            continue
        wanted.add(c)
        for p in (RDFS.subClassOf, OWL.equivalentClass, BRICK.isReplacedBy):
            queue.extend(o for o in full.objects(c, p) if isinstance(o, URIRef))
    if missing:
        sys.exit("not in the Brick file: " + ", ".join(sorted(str(m) for m in missing)))

    out = Graph()
    out.bind("brick", BRICK); out.bind("tag", TAG); out.bind("ref", REF)
    out.bind("owl", OWL); out.bind("rdfs", RDFS); out.bind("skos", SKOS)
    tags = set()
    for c in wanted:
        out.add((c, RDF.type, OWL.Class))
        for p in CLASS_PREDICATES:
            for o in full.objects(c, p):
                if isinstance(o, URIRef) and str(o).startswith(str(BRICK)) and o not in wanted:
                    continue  # parents outside Brick's namespace (e.g. REC) stay out of the subset
                if isinstance(o, URIRef) and p in (RDFS.subClassOf, OWL.equivalentClass) \
                        and not str(o).startswith(str(BRICK)):
                    continue
                out.add((c, p, o))
                if p == BRICK.hasAssociatedTag:
                    tags.add(o)
    for t in tags:
        out.add((t, RDF.type, BRICK.Tag))
        for o in full.objects(t, RDFS.label):
            out.add((t, RDFS.label, o))
    for r in RELATIONS:
        prop = BRICK[r]
        for p in (RDF.type, OWL.inverseOf, RDFS.label, SKOS.definition):
            for o in full.objects(prop, p):
                out.add((prop, p, o))
    for term in (REF.hasExternalReference, REF.TimeseriesReference, REF.hasTimeseriesId):
        for p, o in full.predicate_objects(term):
            if isinstance(o, Literal) or p in (RDF.type, RDFS.subClassOf, RDFS.label):
                if not (hasattr(o, "n3") and isinstance(o, URIRef) is False and str(o).startswith("_")):
                    out.add((term, p, o))
        if (term, None, None) not in out:
            out.add((term, RDFS.label, Literal(term.split("#")[-1])))
    header = ("# tufa's subset of the Brick vocabulary 1.4.4 (https://brickschema.org/schema/Brick#).\n"
              "# Generated by ontology-extensions/tools/brick_subset.py from Brick.ttl (BSD-3-Clause,\n"
              "# Copyright (c) 2016-2023 Brick Consortium, Inc.; see ontology-extensions/NOTICE). Do not edit by hand:\n"
              "# add a class to SEEDS in the script and rerun it.\n")
    nt = sorted(out.serialize(format="nt").splitlines())
    g2 = Graph()
    for k, v in out.namespaces():
        g2.bind(k, v)
    g2.parse(data="\n".join(nt), format="nt")
    with open(dst, "w", encoding="utf-8") as f:
        f.write(header)
        f.write(g2.serialize(format="turtle"))
    print(f"{len(wanted)} classes, {len(tags)} tags, {len(out)} triples -> {dst}")


if __name__ == "__main__":
    main(sys.argv[1], sys.argv[2])
