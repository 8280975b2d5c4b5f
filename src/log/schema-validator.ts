// @ts-nocheck
/* eslint-disable */
// Generated from src/log/schema.ts by ajv standalone code (npx tsx test/log/schema-generate.ts). Do not edit.
"use strict";
export const validate = validate20;
export default validate20;
const schema31 = {"$schema":"https://json-schema.org/draft/2020-12/schema","$id":"https://plummet.invalid/schema/plummet-log-1.schema.json","title":"Plummet log file, format 1","description":"A whole test log or a chosen part of it, written as canonical JSON (RFC 8785). SI units, the unit in each field name; a standard uncertainty of x_unit is u_x_unit. Records are never replaced on import: each is merged by its revision (a hybrid logical clock stamp; the higher is the newer).","type":"object","required":["format","format_version","app_version","device","selection","records"],"properties":{"format":{"const":"plummet-log"},"format_version":{"const":1},"app_version":{"type":"string"},"device":{"$ref":"#/$defs/device"},"selection":{"anyOf":[{"type":"object","description":"What part of the log was chosen; null for the whole log. Records the chosen ones refer to are included.","required":["day_ids","specimen_ids","site_ids","kinds"],"properties":{"day_ids":{"type":"array","items":{"$ref":"#/$defs/id"}},"specimen_ids":{"type":"array","items":{"$ref":"#/$defs/id"}},"site_ids":{"type":"array","items":{"$ref":"#/$defs/id"}},"kinds":{"type":"array","items":{"type":"string","enum":["site","specimen","day","reading","series","drop"]}}},"additionalProperties":false},{"type":"null"}]},"records":{"type":"array","items":{"$ref":"#/$defs/record"}}},"additionalProperties":false,"$defs":{"id":{"type":"string","pattern":"^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$","description":"A record id: a UUID (RFC 9562)."},"instant":{"type":"string","pattern":"^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$","description":"ISO 8601 instant in UTC, e.g. 2026-06-14T09:12:03.412Z."},"date":{"type":"string","pattern":"^\\d{4}-\\d{2}-\\d{2}$","description":"A calendar date, YYYY-MM-DD."},"device":{"type":"string","pattern":"^[A-Za-z0-9_.:]+$","description":"The id of the phone that made it."},"rev":{"type":"string","pattern":"^\\d{15}-\\d{6}-[A-Za-z0-9_.:]+$","description":"Hybrid logical clock stamp \"<ms, 15 digits>-<counter, 6 digits>-<device>\"; sorts as text."},"revision":{"type":"object","description":"An earlier version of a record.","required":["rev","device","updated_at","reason","deleted","body"],"properties":{"rev":{"$ref":"#/$defs/rev"},"device":{"$ref":"#/$defs/device"},"updated_at":{"$ref":"#/$defs/instant"},"reason":{"anyOf":[{"type":"string"},{"type":"null"}]},"deleted":{"type":"boolean"},"body":{"type":"object","description":"The record's own fields as they were in this version."}},"additionalProperties":false},"record":{"type":"object","required":["kind"],"properties":{"kind":{"type":"string","enum":["site","specimen","day","reading","series","drop"]}},"allOf":[{"if":{"properties":{"kind":{"const":"site"}},"required":["kind"]},"then":{"$ref":"#/$defs/site_record"}},{"if":{"properties":{"kind":{"const":"specimen"}},"required":["kind"]},"then":{"$ref":"#/$defs/specimen_record"}},{"if":{"properties":{"kind":{"const":"day"}},"required":["kind"]},"then":{"$ref":"#/$defs/day_record"}},{"if":{"properties":{"kind":{"const":"reading"}},"required":["kind"]},"then":{"$ref":"#/$defs/reading_record"}},{"if":{"properties":{"kind":{"const":"series"}},"required":["kind"]},"then":{"$ref":"#/$defs/series_record"}},{"if":{"properties":{"kind":{"const":"drop"}},"required":["kind"]},"then":{"$ref":"#/$defs/drop_record"}}]},"site_record":{"type":"object","required":["id","kind","created_at","updated_at","rev","device","deleted","history","name","latitude_deg","longitude_deg","elevation_m","elevation_source","notes"],"properties":{"id":{"$ref":"#/$defs/id"},"kind":{"const":"site"},"created_at":{"$ref":"#/$defs/instant"},"updated_at":{"$ref":"#/$defs/instant"},"rev":{"$ref":"#/$defs/rev"},"device":{"$ref":"#/$defs/device"},"deleted":{"type":"boolean","description":"A deleted record stays as a tombstone so the deletion travels."},"history":{"type":"array","items":{"$ref":"#/$defs/revision"},"description":"Earlier versions, oldest first."},"name":{"type":"string"},"latitude_deg":{"type":"number","minimum":-90,"maximum":90},"longitude_deg":{"type":"number","minimum":-180,"maximum":180},"elevation_m":{"type":"number","minimum":-500,"maximum":9000},"elevation_source":{"type":"string","enum":["survey","map","gps","other"]},"notes":{"type":"string"}},"additionalProperties":false},"specimen_record":{"type":"object","required":["id","kind","created_at","updated_at","rev","device","deleted","history","name","mass_kg","u_mass_kg","shape","reference_drag_coefficient","notes"],"properties":{"id":{"$ref":"#/$defs/id"},"kind":{"const":"specimen"},"created_at":{"$ref":"#/$defs/instant"},"updated_at":{"$ref":"#/$defs/instant"},"rev":{"$ref":"#/$defs/rev"},"device":{"$ref":"#/$defs/device"},"deleted":{"type":"boolean","description":"A deleted record stays as a tombstone so the deletion travels."},"history":{"type":"array","items":{"$ref":"#/$defs/revision"},"description":"Earlier versions, oldest first."},"name":{"type":"string"},"mass_kg":{"type":"number","exclusiveMinimum":0,"maximum":1000},"u_mass_kg":{"type":"number","minimum":0},"shape":{"type":"object","description":"The body: a sphere, an upright cylinder, a flat disc, a box (length × width face down), or custom area and volume.","required":["kind"],"properties":{"kind":{"type":"string","enum":["sphere","cylinder","disc","box","custom"]}},"allOf":[{"if":{"properties":{"kind":{"const":"sphere"}},"required":["kind"]},"then":{"type":"object","required":["kind","diameter_m","u_diameter_m"],"properties":{"kind":{"const":"sphere"},"diameter_m":{"type":"number","exclusiveMinimum":0,"maximum":20},"u_diameter_m":{"type":"number","minimum":0}},"additionalProperties":false}},{"if":{"properties":{"kind":{"const":"cylinder"}},"required":["kind"]},"then":{"type":"object","required":["kind","diameter_m","u_diameter_m","length_m","u_length_m"],"properties":{"kind":{"const":"cylinder"},"diameter_m":{"type":"number","exclusiveMinimum":0,"maximum":20},"u_diameter_m":{"type":"number","minimum":0},"length_m":{"type":"number","exclusiveMinimum":0,"maximum":20},"u_length_m":{"type":"number","minimum":0}},"additionalProperties":false}},{"if":{"properties":{"kind":{"const":"disc"}},"required":["kind"]},"then":{"type":"object","required":["kind","diameter_m","u_diameter_m","thickness_m","u_thickness_m"],"properties":{"kind":{"const":"disc"},"diameter_m":{"type":"number","exclusiveMinimum":0,"maximum":20},"u_diameter_m":{"type":"number","minimum":0},"thickness_m":{"type":"number","exclusiveMinimum":0,"maximum":20},"u_thickness_m":{"type":"number","minimum":0}},"additionalProperties":false}},{"if":{"properties":{"kind":{"const":"box"}},"required":["kind"]},"then":{"type":"object","required":["kind","length_m","u_length_m","width_m","u_width_m","height_m","u_height_m"],"properties":{"kind":{"const":"box"},"length_m":{"type":"number","exclusiveMinimum":0,"maximum":20},"u_length_m":{"type":"number","minimum":0},"width_m":{"type":"number","exclusiveMinimum":0,"maximum":20},"u_width_m":{"type":"number","minimum":0},"height_m":{"type":"number","exclusiveMinimum":0,"maximum":20},"u_height_m":{"type":"number","minimum":0}},"additionalProperties":false}},{"if":{"properties":{"kind":{"const":"custom"}},"required":["kind"]},"then":{"type":"object","required":["kind","area_m2","u_area_m2","volume_m3","u_volume_m3"],"properties":{"kind":{"const":"custom"},"area_m2":{"type":"number","exclusiveMinimum":0,"maximum":1000},"u_area_m2":{"type":"number","minimum":0},"volume_m3":{"type":"number","exclusiveMinimum":0,"maximum":1000},"u_volume_m3":{"type":"number","minimum":0}},"additionalProperties":false}}]},"reference_drag_coefficient":{"anyOf":[{"type":"number","exclusiveMinimum":0,"maximum":5},{"type":"null"}]},"notes":{"type":"string"}},"additionalProperties":false},"day_record":{"type":"object","required":["id","kind","created_at","updated_at","rev","device","deleted","history","site_id","date","crew","notes"],"properties":{"id":{"$ref":"#/$defs/id"},"kind":{"const":"day"},"created_at":{"$ref":"#/$defs/instant"},"updated_at":{"$ref":"#/$defs/instant"},"rev":{"$ref":"#/$defs/rev"},"device":{"$ref":"#/$defs/device"},"deleted":{"type":"boolean","description":"A deleted record stays as a tombstone so the deletion travels."},"history":{"type":"array","items":{"$ref":"#/$defs/revision"},"description":"Earlier versions, oldest first."},"site_id":{"$ref":"#/$defs/id"},"date":{"$ref":"#/$defs/date"},"crew":{"type":"array","items":{"type":"string"}},"notes":{"type":"string"}},"additionalProperties":false},"reading_record":{"type":"object","required":["id","kind","created_at","updated_at","rev","device","deleted","history","day_id","taken_at","temperature_C","u_temperature_C","pressure_Pa","u_pressure_Pa","pressure_reference","humidity","wind_speed_m_s","instrument","notes"],"properties":{"id":{"$ref":"#/$defs/id"},"kind":{"const":"reading"},"created_at":{"$ref":"#/$defs/instant"},"updated_at":{"$ref":"#/$defs/instant"},"rev":{"$ref":"#/$defs/rev"},"device":{"$ref":"#/$defs/device"},"deleted":{"type":"boolean","description":"A deleted record stays as a tombstone so the deletion travels."},"history":{"type":"array","items":{"$ref":"#/$defs/revision"},"description":"Earlier versions, oldest first."},"day_id":{"$ref":"#/$defs/id"},"taken_at":{"$ref":"#/$defs/instant"},"temperature_C":{"type":"number","minimum":-90,"maximum":60},"u_temperature_C":{"type":"number","minimum":0,"maximum":10},"pressure_Pa":{"type":"number","description":"Station or sea-level pressure, as pressure_reference says."},"u_pressure_Pa":{"type":"number","minimum":0,"maximum":5000},"pressure_reference":{"type":"string","enum":["station","sea_level"]},"humidity":{"type":"object","description":"Relative humidity or dew point.","required":["kind"],"properties":{"kind":{"type":"string","enum":["relative","dew_point"]}},"allOf":[{"if":{"properties":{"kind":{"const":"relative"}},"required":["kind"]},"then":{"type":"object","required":["kind","relative_humidity_pct","u_relative_humidity_pct"],"properties":{"kind":{"const":"relative"},"relative_humidity_pct":{"type":"number","minimum":0,"maximum":100},"u_relative_humidity_pct":{"type":"number","minimum":0,"maximum":100}},"additionalProperties":false}},{"if":{"properties":{"kind":{"const":"dew_point"}},"required":["kind"]},"then":{"type":"object","required":["kind","dew_point_C","u_dew_point_C"],"properties":{"kind":{"const":"dew_point"},"dew_point_C":{"type":"number","minimum":-90,"maximum":60},"u_dew_point_C":{"type":"number","minimum":0,"maximum":10}},"additionalProperties":false}}]},"wind_speed_m_s":{"anyOf":[{"type":"number","minimum":0,"maximum":75},{"type":"null"}]},"instrument":{"type":"string"},"notes":{"type":"string"}},"additionalProperties":false,"if":{"properties":{"pressure_reference":{"const":"sea_level"}},"required":["pressure_reference"]},"then":{"properties":{"pressure_Pa":{"type":"number","minimum":85000,"maximum":110000}}},"else":{"properties":{"pressure_Pa":{"type":"number","minimum":30000,"maximum":110000}}}},"series_record":{"type":"object","required":["id","kind","created_at","updated_at","rev","device","deleted","history","day_id","specimen_id","height_m","u_height_m","height_method","timing_method","u_time_s","target_relative_uncertainty","reading_id","timing_offset","started_at","notes"],"properties":{"id":{"$ref":"#/$defs/id"},"kind":{"const":"series"},"created_at":{"$ref":"#/$defs/instant"},"updated_at":{"$ref":"#/$defs/instant"},"rev":{"$ref":"#/$defs/rev"},"device":{"$ref":"#/$defs/device"},"deleted":{"type":"boolean","description":"A deleted record stays as a tombstone so the deletion travels."},"history":{"type":"array","items":{"$ref":"#/$defs/revision"},"description":"Earlier versions, oldest first."},"day_id":{"$ref":"#/$defs/id"},"specimen_id":{"$ref":"#/$defs/id"},"height_m":{"type":"number","exclusiveMinimum":0,"maximum":1000,"description":"Release height above the landing surface."},"u_height_m":{"type":"number","minimum":0},"height_method":{"type":"string","enum":["tape","laser","survey","marked","other"]},"timing_method":{"type":"string","enum":["typed","stopwatch","tap","sound","video","gates"]},"u_time_s":{"type":"number","minimum":0,"maximum":10,"description":"Standard uncertainty of one drop time from random causes."},"target_relative_uncertainty":{"type":"number","exclusiveMinimum":0,"maximum":1},"reading_id":{"anyOf":[{"$ref":"#/$defs/id"},{"type":"null"}]},"timing_offset":{"type":"string","enum":["none","fit"]},"started_at":{"$ref":"#/$defs/instant"},"notes":{"type":"string"}},"additionalProperties":false},"drop_record":{"type":"object","required":["id","kind","created_at","updated_at","rev","device","deleted","history","series_id","seq","raw","time_s","height_m","excluded","exclusion_reason","note","captured_at"],"properties":{"id":{"$ref":"#/$defs/id"},"kind":{"const":"drop"},"created_at":{"$ref":"#/$defs/instant"},"updated_at":{"$ref":"#/$defs/instant"},"rev":{"$ref":"#/$defs/rev"},"device":{"$ref":"#/$defs/device"},"deleted":{"type":"boolean","description":"A deleted record stays as a tombstone so the deletion travels."},"history":{"type":"array","items":{"$ref":"#/$defs/revision"},"description":"Earlier versions, oldest first."},"series_id":{"$ref":"#/$defs/id"},"seq":{"type":"integer","minimum":1},"raw":{"type":"object","description":"The capture exactly as it came from the phone or the keyboard.","required":["kind"],"properties":{"kind":{"type":"string","enum":["typed","taps","sound","frames"]}},"allOf":[{"if":{"properties":{"kind":{"const":"typed"}},"required":["kind"]},"then":{"type":"object","required":["kind","text"],"properties":{"kind":{"const":"typed"},"text":{"type":"string"}},"additionalProperties":false}},{"if":{"properties":{"kind":{"const":"taps"}},"required":["kind"]},"then":{"type":"object","required":["kind","timestamps_ms"],"properties":{"kind":{"const":"taps"},"timestamps_ms":{"type":"array","minItems":2,"items":{"type":"number","minimum":0}}},"additionalProperties":false}},{"if":{"properties":{"kind":{"const":"sound"}},"required":["kind"]},"then":{"type":"object","required":["kind","onsets_s","sample_rate_Hz"],"properties":{"kind":{"const":"sound"},"onsets_s":{"type":"array","minItems":2,"items":{"type":"number","minimum":0}},"sample_rate_Hz":{"type":"number","exclusiveMinimum":0,"maximum":384000}},"additionalProperties":false}},{"if":{"properties":{"kind":{"const":"frames"}},"required":["kind"]},"then":{"type":"object","required":["kind","frames","frame_rate_Hz"],"properties":{"kind":{"const":"frames"},"frames":{"type":"array","minItems":2,"items":{"type":"integer","minimum":0}},"frame_rate_Hz":{"type":"number","exclusiveMinimum":0,"maximum":1000000}},"additionalProperties":false}}]},"time_s":{"type":"number","exclusiveMinimum":0,"maximum":3600},"height_m":{"anyOf":[{"type":"number","exclusiveMinimum":0,"maximum":1000},{"type":"null"}]},"excluded":{"type":"boolean"},"exclusion_reason":{"anyOf":[{"type":"string"},{"type":"null"}]},"note":{"type":"string"},"captured_at":{"$ref":"#/$defs/instant"}},"additionalProperties":false}}};
const schema32 = {"type":"string","pattern":"^[A-Za-z0-9_.:]+$","description":"The id of the phone that made it."};
const schema33 = {"type":"string","pattern":"^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$","description":"A record id: a UUID (RFC 9562)."};
const pattern4 = new RegExp("^[A-Za-z0-9_.:]+$", "u");
const pattern5 = new RegExp("^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$", "u");
const schema36 = {"type":"object","required":["kind"],"properties":{"kind":{"type":"string","enum":["site","specimen","day","reading","series","drop"]}},"allOf":[{"if":{"properties":{"kind":{"const":"site"}},"required":["kind"]},"then":{"$ref":"#/$defs/site_record"}},{"if":{"properties":{"kind":{"const":"specimen"}},"required":["kind"]},"then":{"$ref":"#/$defs/specimen_record"}},{"if":{"properties":{"kind":{"const":"day"}},"required":["kind"]},"then":{"$ref":"#/$defs/day_record"}},{"if":{"properties":{"kind":{"const":"reading"}},"required":["kind"]},"then":{"$ref":"#/$defs/reading_record"}},{"if":{"properties":{"kind":{"const":"series"}},"required":["kind"]},"then":{"$ref":"#/$defs/series_record"}},{"if":{"properties":{"kind":{"const":"drop"}},"required":["kind"]},"then":{"$ref":"#/$defs/drop_record"}}]};
const schema37 = {"type":"object","required":["id","kind","created_at","updated_at","rev","device","deleted","history","name","latitude_deg","longitude_deg","elevation_m","elevation_source","notes"],"properties":{"id":{"$ref":"#/$defs/id"},"kind":{"const":"site"},"created_at":{"$ref":"#/$defs/instant"},"updated_at":{"$ref":"#/$defs/instant"},"rev":{"$ref":"#/$defs/rev"},"device":{"$ref":"#/$defs/device"},"deleted":{"type":"boolean","description":"A deleted record stays as a tombstone so the deletion travels."},"history":{"type":"array","items":{"$ref":"#/$defs/revision"},"description":"Earlier versions, oldest first."},"name":{"type":"string"},"latitude_deg":{"type":"number","minimum":-90,"maximum":90},"longitude_deg":{"type":"number","minimum":-180,"maximum":180},"elevation_m":{"type":"number","minimum":-500,"maximum":9000},"elevation_source":{"type":"string","enum":["survey","map","gps","other"]},"notes":{"type":"string"}},"additionalProperties":false};
const schema39 = {"type":"string","pattern":"^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$","description":"ISO 8601 instant in UTC, e.g. 2026-06-14T09:12:03.412Z."};
const schema41 = {"type":"string","pattern":"^\\d{15}-\\d{6}-[A-Za-z0-9_.:]+$","description":"Hybrid logical clock stamp \"<ms, 15 digits>-<counter, 6 digits>-<device>\"; sorts as text."};
const func1 = Object.prototype.hasOwnProperty;
const pattern9 = new RegExp("^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$", "u");
const pattern11 = new RegExp("^\\d{15}-\\d{6}-[A-Za-z0-9_.:]+$", "u");
const schema43 = {"type":"object","description":"An earlier version of a record.","required":["rev","device","updated_at","reason","deleted","body"],"properties":{"rev":{"$ref":"#/$defs/rev"},"device":{"$ref":"#/$defs/device"},"updated_at":{"$ref":"#/$defs/instant"},"reason":{"anyOf":[{"type":"string"},{"type":"null"}]},"deleted":{"type":"boolean"},"body":{"type":"object","description":"The record's own fields as they were in this version."}},"additionalProperties":false};

function validate23(data, {instancePath="", parentData, parentDataProperty, rootData=data, dynamicAnchors={}}={}){
let vErrors = null;
let errors = 0;
const evaluated0 = validate23.evaluated;
if(evaluated0.dynamicProps){
evaluated0.props = undefined;
}
if(evaluated0.dynamicItems){
evaluated0.items = undefined;
}
if(errors === 0){
if(data && typeof data == "object" && !Array.isArray(data)){
let missing0;
if(((((((data.rev === undefined) && (missing0 = "rev")) || ((data.device === undefined) && (missing0 = "device"))) || ((data.updated_at === undefined) && (missing0 = "updated_at"))) || ((data.reason === undefined) && (missing0 = "reason"))) || ((data.deleted === undefined) && (missing0 = "deleted"))) || ((data.body === undefined) && (missing0 = "body"))){
validate23.errors = [{instancePath,schemaPath:"#/required",keyword:"required",params:{missingProperty: missing0},message:"must have required property '"+missing0+"'"}];
return false;
}
else {
const _errs1 = errors;
for(const key0 in data){
if(!((((((key0 === "rev") || (key0 === "device")) || (key0 === "updated_at")) || (key0 === "reason")) || (key0 === "deleted")) || (key0 === "body"))){
validate23.errors = [{instancePath,schemaPath:"#/additionalProperties",keyword:"additionalProperties",params:{additionalProperty: key0},message:"must NOT have additional properties"}];
return false;
break;
}
}
if(_errs1 === errors){
if(data.rev !== undefined){
let data0 = data.rev;
const _errs2 = errors;
const _errs3 = errors;
if(errors === _errs3){
if(typeof data0 === "string"){
if(!pattern11.test(data0)){
validate23.errors = [{instancePath:instancePath+"/rev",schemaPath:"#/$defs/rev/pattern",keyword:"pattern",params:{pattern: "^\\d{15}-\\d{6}-[A-Za-z0-9_.:]+$"},message:"must match pattern \""+"^\\d{15}-\\d{6}-[A-Za-z0-9_.:]+$"+"\""}];
return false;
}
}
else {
validate23.errors = [{instancePath:instancePath+"/rev",schemaPath:"#/$defs/rev/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs2 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.device !== undefined){
let data1 = data.device;
const _errs5 = errors;
const _errs6 = errors;
if(errors === _errs6){
if(typeof data1 === "string"){
if(!pattern4.test(data1)){
validate23.errors = [{instancePath:instancePath+"/device",schemaPath:"#/$defs/device/pattern",keyword:"pattern",params:{pattern: "^[A-Za-z0-9_.:]+$"},message:"must match pattern \""+"^[A-Za-z0-9_.:]+$"+"\""}];
return false;
}
}
else {
validate23.errors = [{instancePath:instancePath+"/device",schemaPath:"#/$defs/device/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs5 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.updated_at !== undefined){
let data2 = data.updated_at;
const _errs8 = errors;
const _errs9 = errors;
if(errors === _errs9){
if(typeof data2 === "string"){
if(!pattern9.test(data2)){
validate23.errors = [{instancePath:instancePath+"/updated_at",schemaPath:"#/$defs/instant/pattern",keyword:"pattern",params:{pattern: "^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"},message:"must match pattern \""+"^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"+"\""}];
return false;
}
}
else {
validate23.errors = [{instancePath:instancePath+"/updated_at",schemaPath:"#/$defs/instant/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs8 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.reason !== undefined){
let data3 = data.reason;
const _errs11 = errors;
const _errs12 = errors;
let valid4 = false;
const _errs13 = errors;
if(typeof data3 !== "string"){
const err0 = {instancePath:instancePath+"/reason",schemaPath:"#/properties/reason/anyOf/0/type",keyword:"type",params:{type: "string"},message:"must be string"};
if(vErrors === null){
vErrors = [err0];
}
else {
vErrors.push(err0);
}
errors++;
}
var _valid0 = _errs13 === errors;
valid4 = valid4 || _valid0;
const _errs15 = errors;
if(data3 !== null){
const err1 = {instancePath:instancePath+"/reason",schemaPath:"#/properties/reason/anyOf/1/type",keyword:"type",params:{type: "null"},message:"must be null"};
if(vErrors === null){
vErrors = [err1];
}
else {
vErrors.push(err1);
}
errors++;
}
var _valid0 = _errs15 === errors;
valid4 = valid4 || _valid0;
if(!valid4){
const err2 = {instancePath:instancePath+"/reason",schemaPath:"#/properties/reason/anyOf",keyword:"anyOf",params:{},message:"must match a schema in anyOf"};
if(vErrors === null){
vErrors = [err2];
}
else {
vErrors.push(err2);
}
errors++;
validate23.errors = vErrors;
return false;
}
else {
errors = _errs12;
if(vErrors !== null){
if(_errs12){
vErrors.length = _errs12;
}
else {
vErrors = null;
}
}
}
var valid0 = _errs11 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.deleted !== undefined){
const _errs17 = errors;
if(typeof data.deleted !== "boolean"){
validate23.errors = [{instancePath:instancePath+"/deleted",schemaPath:"#/properties/deleted/type",keyword:"type",params:{type: "boolean"},message:"must be boolean"}];
return false;
}
var valid0 = _errs17 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.body !== undefined){
let data5 = data.body;
const _errs19 = errors;
if(!(data5 && typeof data5 == "object" && !Array.isArray(data5))){
validate23.errors = [{instancePath:instancePath+"/body",schemaPath:"#/properties/body/type",keyword:"type",params:{type: "object"},message:"must be object"}];
return false;
}
var valid0 = _errs19 === errors;
}
else {
var valid0 = true;
}
}
}
}
}
}
}
}
}
else {
validate23.errors = [{instancePath,schemaPath:"#/type",keyword:"type",params:{type: "object"},message:"must be object"}];
return false;
}
}
validate23.errors = vErrors;
return errors === 0;
}
validate23.evaluated = {"props":true,"dynamicProps":false,"dynamicItems":false};


function validate22(data, {instancePath="", parentData, parentDataProperty, rootData=data, dynamicAnchors={}}={}){
let vErrors = null;
let errors = 0;
const evaluated0 = validate22.evaluated;
if(evaluated0.dynamicProps){
evaluated0.props = undefined;
}
if(evaluated0.dynamicItems){
evaluated0.items = undefined;
}
if(errors === 0){
if(data && typeof data == "object" && !Array.isArray(data)){
let missing0;
if(((((((((((((((data.id === undefined) && (missing0 = "id")) || ((data.kind === undefined) && (missing0 = "kind"))) || ((data.created_at === undefined) && (missing0 = "created_at"))) || ((data.updated_at === undefined) && (missing0 = "updated_at"))) || ((data.rev === undefined) && (missing0 = "rev"))) || ((data.device === undefined) && (missing0 = "device"))) || ((data.deleted === undefined) && (missing0 = "deleted"))) || ((data.history === undefined) && (missing0 = "history"))) || ((data.name === undefined) && (missing0 = "name"))) || ((data.latitude_deg === undefined) && (missing0 = "latitude_deg"))) || ((data.longitude_deg === undefined) && (missing0 = "longitude_deg"))) || ((data.elevation_m === undefined) && (missing0 = "elevation_m"))) || ((data.elevation_source === undefined) && (missing0 = "elevation_source"))) || ((data.notes === undefined) && (missing0 = "notes"))){
validate22.errors = [{instancePath,schemaPath:"#/required",keyword:"required",params:{missingProperty: missing0},message:"must have required property '"+missing0+"'"}];
return false;
}
else {
const _errs1 = errors;
for(const key0 in data){
if(!(func1.call(schema37.properties, key0))){
validate22.errors = [{instancePath,schemaPath:"#/additionalProperties",keyword:"additionalProperties",params:{additionalProperty: key0},message:"must NOT have additional properties"}];
return false;
break;
}
}
if(_errs1 === errors){
if(data.id !== undefined){
let data0 = data.id;
const _errs2 = errors;
const _errs3 = errors;
if(errors === _errs3){
if(typeof data0 === "string"){
if(!pattern5.test(data0)){
validate22.errors = [{instancePath:instancePath+"/id",schemaPath:"#/$defs/id/pattern",keyword:"pattern",params:{pattern: "^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"},message:"must match pattern \""+"^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"+"\""}];
return false;
}
}
else {
validate22.errors = [{instancePath:instancePath+"/id",schemaPath:"#/$defs/id/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs2 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.kind !== undefined){
const _errs5 = errors;
if("site" !== data.kind){
validate22.errors = [{instancePath:instancePath+"/kind",schemaPath:"#/properties/kind/const",keyword:"const",params:{allowedValue: "site"},message:"must be equal to constant"}];
return false;
}
var valid0 = _errs5 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.created_at !== undefined){
let data2 = data.created_at;
const _errs6 = errors;
const _errs7 = errors;
if(errors === _errs7){
if(typeof data2 === "string"){
if(!pattern9.test(data2)){
validate22.errors = [{instancePath:instancePath+"/created_at",schemaPath:"#/$defs/instant/pattern",keyword:"pattern",params:{pattern: "^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"},message:"must match pattern \""+"^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"+"\""}];
return false;
}
}
else {
validate22.errors = [{instancePath:instancePath+"/created_at",schemaPath:"#/$defs/instant/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs6 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.updated_at !== undefined){
let data3 = data.updated_at;
const _errs9 = errors;
const _errs10 = errors;
if(errors === _errs10){
if(typeof data3 === "string"){
if(!pattern9.test(data3)){
validate22.errors = [{instancePath:instancePath+"/updated_at",schemaPath:"#/$defs/instant/pattern",keyword:"pattern",params:{pattern: "^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"},message:"must match pattern \""+"^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"+"\""}];
return false;
}
}
else {
validate22.errors = [{instancePath:instancePath+"/updated_at",schemaPath:"#/$defs/instant/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs9 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.rev !== undefined){
let data4 = data.rev;
const _errs12 = errors;
const _errs13 = errors;
if(errors === _errs13){
if(typeof data4 === "string"){
if(!pattern11.test(data4)){
validate22.errors = [{instancePath:instancePath+"/rev",schemaPath:"#/$defs/rev/pattern",keyword:"pattern",params:{pattern: "^\\d{15}-\\d{6}-[A-Za-z0-9_.:]+$"},message:"must match pattern \""+"^\\d{15}-\\d{6}-[A-Za-z0-9_.:]+$"+"\""}];
return false;
}
}
else {
validate22.errors = [{instancePath:instancePath+"/rev",schemaPath:"#/$defs/rev/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs12 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.device !== undefined){
let data5 = data.device;
const _errs15 = errors;
const _errs16 = errors;
if(errors === _errs16){
if(typeof data5 === "string"){
if(!pattern4.test(data5)){
validate22.errors = [{instancePath:instancePath+"/device",schemaPath:"#/$defs/device/pattern",keyword:"pattern",params:{pattern: "^[A-Za-z0-9_.:]+$"},message:"must match pattern \""+"^[A-Za-z0-9_.:]+$"+"\""}];
return false;
}
}
else {
validate22.errors = [{instancePath:instancePath+"/device",schemaPath:"#/$defs/device/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs15 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.deleted !== undefined){
const _errs18 = errors;
if(typeof data.deleted !== "boolean"){
validate22.errors = [{instancePath:instancePath+"/deleted",schemaPath:"#/properties/deleted/type",keyword:"type",params:{type: "boolean"},message:"must be boolean"}];
return false;
}
var valid0 = _errs18 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.history !== undefined){
let data7 = data.history;
const _errs20 = errors;
if(errors === _errs20){
if(Array.isArray(data7)){
var valid6 = true;
const len0 = data7.length;
for(let i0=0; i0<len0; i0++){
const _errs22 = errors;
if(!(validate23(data7[i0], {instancePath:instancePath+"/history/" + i0,parentData:data7,parentDataProperty:i0,rootData,dynamicAnchors}))){
vErrors = vErrors === null ? validate23.errors : vErrors.concat(validate23.errors);
errors = vErrors.length;
}
var valid6 = _errs22 === errors;
if(!valid6){
break;
}
}
}
else {
validate22.errors = [{instancePath:instancePath+"/history",schemaPath:"#/properties/history/type",keyword:"type",params:{type: "array"},message:"must be array"}];
return false;
}
}
var valid0 = _errs20 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.name !== undefined){
const _errs23 = errors;
if(typeof data.name !== "string"){
validate22.errors = [{instancePath:instancePath+"/name",schemaPath:"#/properties/name/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
var valid0 = _errs23 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.latitude_deg !== undefined){
let data10 = data.latitude_deg;
const _errs25 = errors;
if(errors === _errs25){
if((typeof data10 == "number") && (isFinite(data10))){
if(data10 > 90 || isNaN(data10)){
validate22.errors = [{instancePath:instancePath+"/latitude_deg",schemaPath:"#/properties/latitude_deg/maximum",keyword:"maximum",params:{comparison: "<=", limit: 90},message:"must be <= 90"}];
return false;
}
else {
if(data10 < -90 || isNaN(data10)){
validate22.errors = [{instancePath:instancePath+"/latitude_deg",schemaPath:"#/properties/latitude_deg/minimum",keyword:"minimum",params:{comparison: ">=", limit: -90},message:"must be >= -90"}];
return false;
}
}
}
else {
validate22.errors = [{instancePath:instancePath+"/latitude_deg",schemaPath:"#/properties/latitude_deg/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid0 = _errs25 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.longitude_deg !== undefined){
let data11 = data.longitude_deg;
const _errs27 = errors;
if(errors === _errs27){
if((typeof data11 == "number") && (isFinite(data11))){
if(data11 > 180 || isNaN(data11)){
validate22.errors = [{instancePath:instancePath+"/longitude_deg",schemaPath:"#/properties/longitude_deg/maximum",keyword:"maximum",params:{comparison: "<=", limit: 180},message:"must be <= 180"}];
return false;
}
else {
if(data11 < -180 || isNaN(data11)){
validate22.errors = [{instancePath:instancePath+"/longitude_deg",schemaPath:"#/properties/longitude_deg/minimum",keyword:"minimum",params:{comparison: ">=", limit: -180},message:"must be >= -180"}];
return false;
}
}
}
else {
validate22.errors = [{instancePath:instancePath+"/longitude_deg",schemaPath:"#/properties/longitude_deg/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid0 = _errs27 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.elevation_m !== undefined){
let data12 = data.elevation_m;
const _errs29 = errors;
if(errors === _errs29){
if((typeof data12 == "number") && (isFinite(data12))){
if(data12 > 9000 || isNaN(data12)){
validate22.errors = [{instancePath:instancePath+"/elevation_m",schemaPath:"#/properties/elevation_m/maximum",keyword:"maximum",params:{comparison: "<=", limit: 9000},message:"must be <= 9000"}];
return false;
}
else {
if(data12 < -500 || isNaN(data12)){
validate22.errors = [{instancePath:instancePath+"/elevation_m",schemaPath:"#/properties/elevation_m/minimum",keyword:"minimum",params:{comparison: ">=", limit: -500},message:"must be >= -500"}];
return false;
}
}
}
else {
validate22.errors = [{instancePath:instancePath+"/elevation_m",schemaPath:"#/properties/elevation_m/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid0 = _errs29 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.elevation_source !== undefined){
let data13 = data.elevation_source;
const _errs31 = errors;
if(typeof data13 !== "string"){
validate22.errors = [{instancePath:instancePath+"/elevation_source",schemaPath:"#/properties/elevation_source/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
if(!((((data13 === "survey") || (data13 === "map")) || (data13 === "gps")) || (data13 === "other"))){
validate22.errors = [{instancePath:instancePath+"/elevation_source",schemaPath:"#/properties/elevation_source/enum",keyword:"enum",params:{allowedValues: schema37.properties.elevation_source.enum},message:"must be equal to one of the allowed values"}];
return false;
}
var valid0 = _errs31 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.notes !== undefined){
const _errs33 = errors;
if(typeof data.notes !== "string"){
validate22.errors = [{instancePath:instancePath+"/notes",schemaPath:"#/properties/notes/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
var valid0 = _errs33 === errors;
}
else {
var valid0 = true;
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
else {
validate22.errors = [{instancePath,schemaPath:"#/type",keyword:"type",params:{type: "object"},message:"must be object"}];
return false;
}
}
validate22.errors = vErrors;
return errors === 0;
}
validate22.evaluated = {"props":true,"dynamicProps":false,"dynamicItems":false};

const schema47 = {"type":"object","required":["id","kind","created_at","updated_at","rev","device","deleted","history","name","mass_kg","u_mass_kg","shape","reference_drag_coefficient","notes"],"properties":{"id":{"$ref":"#/$defs/id"},"kind":{"const":"specimen"},"created_at":{"$ref":"#/$defs/instant"},"updated_at":{"$ref":"#/$defs/instant"},"rev":{"$ref":"#/$defs/rev"},"device":{"$ref":"#/$defs/device"},"deleted":{"type":"boolean","description":"A deleted record stays as a tombstone so the deletion travels."},"history":{"type":"array","items":{"$ref":"#/$defs/revision"},"description":"Earlier versions, oldest first."},"name":{"type":"string"},"mass_kg":{"type":"number","exclusiveMinimum":0,"maximum":1000},"u_mass_kg":{"type":"number","minimum":0},"shape":{"type":"object","description":"The body: a sphere, an upright cylinder, a flat disc, a box (length × width face down), or custom area and volume.","required":["kind"],"properties":{"kind":{"type":"string","enum":["sphere","cylinder","disc","box","custom"]}},"allOf":[{"if":{"properties":{"kind":{"const":"sphere"}},"required":["kind"]},"then":{"type":"object","required":["kind","diameter_m","u_diameter_m"],"properties":{"kind":{"const":"sphere"},"diameter_m":{"type":"number","exclusiveMinimum":0,"maximum":20},"u_diameter_m":{"type":"number","minimum":0}},"additionalProperties":false}},{"if":{"properties":{"kind":{"const":"cylinder"}},"required":["kind"]},"then":{"type":"object","required":["kind","diameter_m","u_diameter_m","length_m","u_length_m"],"properties":{"kind":{"const":"cylinder"},"diameter_m":{"type":"number","exclusiveMinimum":0,"maximum":20},"u_diameter_m":{"type":"number","minimum":0},"length_m":{"type":"number","exclusiveMinimum":0,"maximum":20},"u_length_m":{"type":"number","minimum":0}},"additionalProperties":false}},{"if":{"properties":{"kind":{"const":"disc"}},"required":["kind"]},"then":{"type":"object","required":["kind","diameter_m","u_diameter_m","thickness_m","u_thickness_m"],"properties":{"kind":{"const":"disc"},"diameter_m":{"type":"number","exclusiveMinimum":0,"maximum":20},"u_diameter_m":{"type":"number","minimum":0},"thickness_m":{"type":"number","exclusiveMinimum":0,"maximum":20},"u_thickness_m":{"type":"number","minimum":0}},"additionalProperties":false}},{"if":{"properties":{"kind":{"const":"box"}},"required":["kind"]},"then":{"type":"object","required":["kind","length_m","u_length_m","width_m","u_width_m","height_m","u_height_m"],"properties":{"kind":{"const":"box"},"length_m":{"type":"number","exclusiveMinimum":0,"maximum":20},"u_length_m":{"type":"number","minimum":0},"width_m":{"type":"number","exclusiveMinimum":0,"maximum":20},"u_width_m":{"type":"number","minimum":0},"height_m":{"type":"number","exclusiveMinimum":0,"maximum":20},"u_height_m":{"type":"number","minimum":0}},"additionalProperties":false}},{"if":{"properties":{"kind":{"const":"custom"}},"required":["kind"]},"then":{"type":"object","required":["kind","area_m2","u_area_m2","volume_m3","u_volume_m3"],"properties":{"kind":{"const":"custom"},"area_m2":{"type":"number","exclusiveMinimum":0,"maximum":1000},"u_area_m2":{"type":"number","minimum":0},"volume_m3":{"type":"number","exclusiveMinimum":0,"maximum":1000},"u_volume_m3":{"type":"number","minimum":0}},"additionalProperties":false}}]},"reference_drag_coefficient":{"anyOf":[{"type":"number","exclusiveMinimum":0,"maximum":5},{"type":"null"}]},"notes":{"type":"string"}},"additionalProperties":false};

function validate26(data, {instancePath="", parentData, parentDataProperty, rootData=data, dynamicAnchors={}}={}){
let vErrors = null;
let errors = 0;
const evaluated0 = validate26.evaluated;
if(evaluated0.dynamicProps){
evaluated0.props = undefined;
}
if(evaluated0.dynamicItems){
evaluated0.items = undefined;
}
if(errors === 0){
if(data && typeof data == "object" && !Array.isArray(data)){
let missing0;
if(((((((((((((((data.id === undefined) && (missing0 = "id")) || ((data.kind === undefined) && (missing0 = "kind"))) || ((data.created_at === undefined) && (missing0 = "created_at"))) || ((data.updated_at === undefined) && (missing0 = "updated_at"))) || ((data.rev === undefined) && (missing0 = "rev"))) || ((data.device === undefined) && (missing0 = "device"))) || ((data.deleted === undefined) && (missing0 = "deleted"))) || ((data.history === undefined) && (missing0 = "history"))) || ((data.name === undefined) && (missing0 = "name"))) || ((data.mass_kg === undefined) && (missing0 = "mass_kg"))) || ((data.u_mass_kg === undefined) && (missing0 = "u_mass_kg"))) || ((data.shape === undefined) && (missing0 = "shape"))) || ((data.reference_drag_coefficient === undefined) && (missing0 = "reference_drag_coefficient"))) || ((data.notes === undefined) && (missing0 = "notes"))){
validate26.errors = [{instancePath,schemaPath:"#/required",keyword:"required",params:{missingProperty: missing0},message:"must have required property '"+missing0+"'"}];
return false;
}
else {
const _errs1 = errors;
for(const key0 in data){
if(!(func1.call(schema47.properties, key0))){
validate26.errors = [{instancePath,schemaPath:"#/additionalProperties",keyword:"additionalProperties",params:{additionalProperty: key0},message:"must NOT have additional properties"}];
return false;
break;
}
}
if(_errs1 === errors){
if(data.id !== undefined){
let data0 = data.id;
const _errs2 = errors;
const _errs3 = errors;
if(errors === _errs3){
if(typeof data0 === "string"){
if(!pattern5.test(data0)){
validate26.errors = [{instancePath:instancePath+"/id",schemaPath:"#/$defs/id/pattern",keyword:"pattern",params:{pattern: "^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"},message:"must match pattern \""+"^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"+"\""}];
return false;
}
}
else {
validate26.errors = [{instancePath:instancePath+"/id",schemaPath:"#/$defs/id/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs2 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.kind !== undefined){
const _errs5 = errors;
if("specimen" !== data.kind){
validate26.errors = [{instancePath:instancePath+"/kind",schemaPath:"#/properties/kind/const",keyword:"const",params:{allowedValue: "specimen"},message:"must be equal to constant"}];
return false;
}
var valid0 = _errs5 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.created_at !== undefined){
let data2 = data.created_at;
const _errs6 = errors;
const _errs7 = errors;
if(errors === _errs7){
if(typeof data2 === "string"){
if(!pattern9.test(data2)){
validate26.errors = [{instancePath:instancePath+"/created_at",schemaPath:"#/$defs/instant/pattern",keyword:"pattern",params:{pattern: "^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"},message:"must match pattern \""+"^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"+"\""}];
return false;
}
}
else {
validate26.errors = [{instancePath:instancePath+"/created_at",schemaPath:"#/$defs/instant/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs6 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.updated_at !== undefined){
let data3 = data.updated_at;
const _errs9 = errors;
const _errs10 = errors;
if(errors === _errs10){
if(typeof data3 === "string"){
if(!pattern9.test(data3)){
validate26.errors = [{instancePath:instancePath+"/updated_at",schemaPath:"#/$defs/instant/pattern",keyword:"pattern",params:{pattern: "^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"},message:"must match pattern \""+"^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"+"\""}];
return false;
}
}
else {
validate26.errors = [{instancePath:instancePath+"/updated_at",schemaPath:"#/$defs/instant/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs9 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.rev !== undefined){
let data4 = data.rev;
const _errs12 = errors;
const _errs13 = errors;
if(errors === _errs13){
if(typeof data4 === "string"){
if(!pattern11.test(data4)){
validate26.errors = [{instancePath:instancePath+"/rev",schemaPath:"#/$defs/rev/pattern",keyword:"pattern",params:{pattern: "^\\d{15}-\\d{6}-[A-Za-z0-9_.:]+$"},message:"must match pattern \""+"^\\d{15}-\\d{6}-[A-Za-z0-9_.:]+$"+"\""}];
return false;
}
}
else {
validate26.errors = [{instancePath:instancePath+"/rev",schemaPath:"#/$defs/rev/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs12 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.device !== undefined){
let data5 = data.device;
const _errs15 = errors;
const _errs16 = errors;
if(errors === _errs16){
if(typeof data5 === "string"){
if(!pattern4.test(data5)){
validate26.errors = [{instancePath:instancePath+"/device",schemaPath:"#/$defs/device/pattern",keyword:"pattern",params:{pattern: "^[A-Za-z0-9_.:]+$"},message:"must match pattern \""+"^[A-Za-z0-9_.:]+$"+"\""}];
return false;
}
}
else {
validate26.errors = [{instancePath:instancePath+"/device",schemaPath:"#/$defs/device/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs15 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.deleted !== undefined){
const _errs18 = errors;
if(typeof data.deleted !== "boolean"){
validate26.errors = [{instancePath:instancePath+"/deleted",schemaPath:"#/properties/deleted/type",keyword:"type",params:{type: "boolean"},message:"must be boolean"}];
return false;
}
var valid0 = _errs18 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.history !== undefined){
let data7 = data.history;
const _errs20 = errors;
if(errors === _errs20){
if(Array.isArray(data7)){
var valid6 = true;
const len0 = data7.length;
for(let i0=0; i0<len0; i0++){
const _errs22 = errors;
if(!(validate23(data7[i0], {instancePath:instancePath+"/history/" + i0,parentData:data7,parentDataProperty:i0,rootData,dynamicAnchors}))){
vErrors = vErrors === null ? validate23.errors : vErrors.concat(validate23.errors);
errors = vErrors.length;
}
var valid6 = _errs22 === errors;
if(!valid6){
break;
}
}
}
else {
validate26.errors = [{instancePath:instancePath+"/history",schemaPath:"#/properties/history/type",keyword:"type",params:{type: "array"},message:"must be array"}];
return false;
}
}
var valid0 = _errs20 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.name !== undefined){
const _errs23 = errors;
if(typeof data.name !== "string"){
validate26.errors = [{instancePath:instancePath+"/name",schemaPath:"#/properties/name/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
var valid0 = _errs23 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.mass_kg !== undefined){
let data10 = data.mass_kg;
const _errs25 = errors;
if(errors === _errs25){
if((typeof data10 == "number") && (isFinite(data10))){
if(data10 > 1000 || isNaN(data10)){
validate26.errors = [{instancePath:instancePath+"/mass_kg",schemaPath:"#/properties/mass_kg/maximum",keyword:"maximum",params:{comparison: "<=", limit: 1000},message:"must be <= 1000"}];
return false;
}
else {
if(data10 <= 0 || isNaN(data10)){
validate26.errors = [{instancePath:instancePath+"/mass_kg",schemaPath:"#/properties/mass_kg/exclusiveMinimum",keyword:"exclusiveMinimum",params:{comparison: ">", limit: 0},message:"must be > 0"}];
return false;
}
}
}
else {
validate26.errors = [{instancePath:instancePath+"/mass_kg",schemaPath:"#/properties/mass_kg/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid0 = _errs25 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.u_mass_kg !== undefined){
let data11 = data.u_mass_kg;
const _errs27 = errors;
if(errors === _errs27){
if((typeof data11 == "number") && (isFinite(data11))){
if(data11 < 0 || isNaN(data11)){
validate26.errors = [{instancePath:instancePath+"/u_mass_kg",schemaPath:"#/properties/u_mass_kg/minimum",keyword:"minimum",params:{comparison: ">=", limit: 0},message:"must be >= 0"}];
return false;
}
}
else {
validate26.errors = [{instancePath:instancePath+"/u_mass_kg",schemaPath:"#/properties/u_mass_kg/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid0 = _errs27 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.shape !== undefined){
let data12 = data.shape;
const _errs29 = errors;
const _errs31 = errors;
const _errs32 = errors;
let valid8 = true;
const _errs33 = errors;
if(data12 && typeof data12 == "object" && !Array.isArray(data12)){
let missing1;
if((data12.kind === undefined) && (missing1 = "kind")){
const err0 = {};
if(vErrors === null){
vErrors = [err0];
}
else {
vErrors.push(err0);
}
errors++;
}
else {
if(data12.kind !== undefined){
if("sphere" !== data12.kind){
const err1 = {};
if(vErrors === null){
vErrors = [err1];
}
else {
vErrors.push(err1);
}
errors++;
}
}
}
}
var _valid0 = _errs33 === errors;
errors = _errs32;
if(vErrors !== null){
if(_errs32){
vErrors.length = _errs32;
}
else {
vErrors = null;
}
}
if(_valid0){
const _errs35 = errors;
if(errors === _errs35){
if(data12 && typeof data12 == "object" && !Array.isArray(data12)){
let missing2;
if((((data12.kind === undefined) && (missing2 = "kind")) || ((data12.diameter_m === undefined) && (missing2 = "diameter_m"))) || ((data12.u_diameter_m === undefined) && (missing2 = "u_diameter_m"))){
validate26.errors = [{instancePath:instancePath+"/shape",schemaPath:"#/properties/shape/allOf/0/then/required",keyword:"required",params:{missingProperty: missing2},message:"must have required property '"+missing2+"'"}];
return false;
}
else {
const _errs37 = errors;
for(const key1 in data12){
if(!(((key1 === "kind") || (key1 === "diameter_m")) || (key1 === "u_diameter_m"))){
validate26.errors = [{instancePath:instancePath+"/shape",schemaPath:"#/properties/shape/allOf/0/then/additionalProperties",keyword:"additionalProperties",params:{additionalProperty: key1},message:"must NOT have additional properties"}];
return false;
break;
}
}
if(_errs37 === errors){
if(data12.kind !== undefined){
const _errs38 = errors;
if("sphere" !== data12.kind){
validate26.errors = [{instancePath:instancePath+"/shape/kind",schemaPath:"#/properties/shape/allOf/0/then/properties/kind/const",keyword:"const",params:{allowedValue: "sphere"},message:"must be equal to constant"}];
return false;
}
var valid10 = _errs38 === errors;
}
else {
var valid10 = true;
}
if(valid10){
if(data12.diameter_m !== undefined){
let data15 = data12.diameter_m;
const _errs39 = errors;
if(errors === _errs39){
if((typeof data15 == "number") && (isFinite(data15))){
if(data15 > 20 || isNaN(data15)){
validate26.errors = [{instancePath:instancePath+"/shape/diameter_m",schemaPath:"#/properties/shape/allOf/0/then/properties/diameter_m/maximum",keyword:"maximum",params:{comparison: "<=", limit: 20},message:"must be <= 20"}];
return false;
}
else {
if(data15 <= 0 || isNaN(data15)){
validate26.errors = [{instancePath:instancePath+"/shape/diameter_m",schemaPath:"#/properties/shape/allOf/0/then/properties/diameter_m/exclusiveMinimum",keyword:"exclusiveMinimum",params:{comparison: ">", limit: 0},message:"must be > 0"}];
return false;
}
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape/diameter_m",schemaPath:"#/properties/shape/allOf/0/then/properties/diameter_m/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid10 = _errs39 === errors;
}
else {
var valid10 = true;
}
if(valid10){
if(data12.u_diameter_m !== undefined){
let data16 = data12.u_diameter_m;
const _errs41 = errors;
if(errors === _errs41){
if((typeof data16 == "number") && (isFinite(data16))){
if(data16 < 0 || isNaN(data16)){
validate26.errors = [{instancePath:instancePath+"/shape/u_diameter_m",schemaPath:"#/properties/shape/allOf/0/then/properties/u_diameter_m/minimum",keyword:"minimum",params:{comparison: ">=", limit: 0},message:"must be >= 0"}];
return false;
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape/u_diameter_m",schemaPath:"#/properties/shape/allOf/0/then/properties/u_diameter_m/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid10 = _errs41 === errors;
}
else {
var valid10 = true;
}
}
}
}
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape",schemaPath:"#/properties/shape/allOf/0/then/type",keyword:"type",params:{type: "object"},message:"must be object"}];
return false;
}
}
var _valid0 = _errs35 === errors;
valid8 = _valid0;
if(valid8){
var props0 = true;
}
}
if(!valid8){
const err2 = {instancePath:instancePath+"/shape",schemaPath:"#/properties/shape/allOf/0/if",keyword:"if",params:{failingKeyword: "then"},message:"must match \"then\" schema"};
if(vErrors === null){
vErrors = [err2];
}
else {
vErrors.push(err2);
}
errors++;
validate26.errors = vErrors;
return false;
}
var valid7 = _errs31 === errors;
if(valid7){
const _errs43 = errors;
const _errs44 = errors;
let valid11 = true;
const _errs45 = errors;
if(data12 && typeof data12 == "object" && !Array.isArray(data12)){
let missing3;
if((data12.kind === undefined) && (missing3 = "kind")){
const err3 = {};
if(vErrors === null){
vErrors = [err3];
}
else {
vErrors.push(err3);
}
errors++;
}
else {
if(data12.kind !== undefined){
if("cylinder" !== data12.kind){
const err4 = {};
if(vErrors === null){
vErrors = [err4];
}
else {
vErrors.push(err4);
}
errors++;
}
}
}
}
var _valid1 = _errs45 === errors;
errors = _errs44;
if(vErrors !== null){
if(_errs44){
vErrors.length = _errs44;
}
else {
vErrors = null;
}
}
if(_valid1){
const _errs47 = errors;
if(errors === _errs47){
if(data12 && typeof data12 == "object" && !Array.isArray(data12)){
let missing4;
if((((((data12.kind === undefined) && (missing4 = "kind")) || ((data12.diameter_m === undefined) && (missing4 = "diameter_m"))) || ((data12.u_diameter_m === undefined) && (missing4 = "u_diameter_m"))) || ((data12.length_m === undefined) && (missing4 = "length_m"))) || ((data12.u_length_m === undefined) && (missing4 = "u_length_m"))){
validate26.errors = [{instancePath:instancePath+"/shape",schemaPath:"#/properties/shape/allOf/1/then/required",keyword:"required",params:{missingProperty: missing4},message:"must have required property '"+missing4+"'"}];
return false;
}
else {
const _errs49 = errors;
for(const key2 in data12){
if(!(((((key2 === "kind") || (key2 === "diameter_m")) || (key2 === "u_diameter_m")) || (key2 === "length_m")) || (key2 === "u_length_m"))){
validate26.errors = [{instancePath:instancePath+"/shape",schemaPath:"#/properties/shape/allOf/1/then/additionalProperties",keyword:"additionalProperties",params:{additionalProperty: key2},message:"must NOT have additional properties"}];
return false;
break;
}
}
if(_errs49 === errors){
if(data12.kind !== undefined){
const _errs50 = errors;
if("cylinder" !== data12.kind){
validate26.errors = [{instancePath:instancePath+"/shape/kind",schemaPath:"#/properties/shape/allOf/1/then/properties/kind/const",keyword:"const",params:{allowedValue: "cylinder"},message:"must be equal to constant"}];
return false;
}
var valid13 = _errs50 === errors;
}
else {
var valid13 = true;
}
if(valid13){
if(data12.diameter_m !== undefined){
let data19 = data12.diameter_m;
const _errs51 = errors;
if(errors === _errs51){
if((typeof data19 == "number") && (isFinite(data19))){
if(data19 > 20 || isNaN(data19)){
validate26.errors = [{instancePath:instancePath+"/shape/diameter_m",schemaPath:"#/properties/shape/allOf/1/then/properties/diameter_m/maximum",keyword:"maximum",params:{comparison: "<=", limit: 20},message:"must be <= 20"}];
return false;
}
else {
if(data19 <= 0 || isNaN(data19)){
validate26.errors = [{instancePath:instancePath+"/shape/diameter_m",schemaPath:"#/properties/shape/allOf/1/then/properties/diameter_m/exclusiveMinimum",keyword:"exclusiveMinimum",params:{comparison: ">", limit: 0},message:"must be > 0"}];
return false;
}
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape/diameter_m",schemaPath:"#/properties/shape/allOf/1/then/properties/diameter_m/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid13 = _errs51 === errors;
}
else {
var valid13 = true;
}
if(valid13){
if(data12.u_diameter_m !== undefined){
let data20 = data12.u_diameter_m;
const _errs53 = errors;
if(errors === _errs53){
if((typeof data20 == "number") && (isFinite(data20))){
if(data20 < 0 || isNaN(data20)){
validate26.errors = [{instancePath:instancePath+"/shape/u_diameter_m",schemaPath:"#/properties/shape/allOf/1/then/properties/u_diameter_m/minimum",keyword:"minimum",params:{comparison: ">=", limit: 0},message:"must be >= 0"}];
return false;
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape/u_diameter_m",schemaPath:"#/properties/shape/allOf/1/then/properties/u_diameter_m/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid13 = _errs53 === errors;
}
else {
var valid13 = true;
}
if(valid13){
if(data12.length_m !== undefined){
let data21 = data12.length_m;
const _errs55 = errors;
if(errors === _errs55){
if((typeof data21 == "number") && (isFinite(data21))){
if(data21 > 20 || isNaN(data21)){
validate26.errors = [{instancePath:instancePath+"/shape/length_m",schemaPath:"#/properties/shape/allOf/1/then/properties/length_m/maximum",keyword:"maximum",params:{comparison: "<=", limit: 20},message:"must be <= 20"}];
return false;
}
else {
if(data21 <= 0 || isNaN(data21)){
validate26.errors = [{instancePath:instancePath+"/shape/length_m",schemaPath:"#/properties/shape/allOf/1/then/properties/length_m/exclusiveMinimum",keyword:"exclusiveMinimum",params:{comparison: ">", limit: 0},message:"must be > 0"}];
return false;
}
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape/length_m",schemaPath:"#/properties/shape/allOf/1/then/properties/length_m/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid13 = _errs55 === errors;
}
else {
var valid13 = true;
}
if(valid13){
if(data12.u_length_m !== undefined){
let data22 = data12.u_length_m;
const _errs57 = errors;
if(errors === _errs57){
if((typeof data22 == "number") && (isFinite(data22))){
if(data22 < 0 || isNaN(data22)){
validate26.errors = [{instancePath:instancePath+"/shape/u_length_m",schemaPath:"#/properties/shape/allOf/1/then/properties/u_length_m/minimum",keyword:"minimum",params:{comparison: ">=", limit: 0},message:"must be >= 0"}];
return false;
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape/u_length_m",schemaPath:"#/properties/shape/allOf/1/then/properties/u_length_m/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid13 = _errs57 === errors;
}
else {
var valid13 = true;
}
}
}
}
}
}
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape",schemaPath:"#/properties/shape/allOf/1/then/type",keyword:"type",params:{type: "object"},message:"must be object"}];
return false;
}
}
var _valid1 = _errs47 === errors;
valid11 = _valid1;
if(valid11){
var props1 = true;
}
}
if(!valid11){
const err5 = {instancePath:instancePath+"/shape",schemaPath:"#/properties/shape/allOf/1/if",keyword:"if",params:{failingKeyword: "then"},message:"must match \"then\" schema"};
if(vErrors === null){
vErrors = [err5];
}
else {
vErrors.push(err5);
}
errors++;
validate26.errors = vErrors;
return false;
}
var valid7 = _errs43 === errors;
if(valid7){
if(props0 !== true && props1 !== undefined){
if(props1 === true){
props0 = true;
}
else {
props0 = props0 || {};
Object.assign(props0, props1);
}
}
const _errs59 = errors;
const _errs60 = errors;
let valid14 = true;
const _errs61 = errors;
if(data12 && typeof data12 == "object" && !Array.isArray(data12)){
let missing5;
if((data12.kind === undefined) && (missing5 = "kind")){
const err6 = {};
if(vErrors === null){
vErrors = [err6];
}
else {
vErrors.push(err6);
}
errors++;
}
else {
if(data12.kind !== undefined){
if("disc" !== data12.kind){
const err7 = {};
if(vErrors === null){
vErrors = [err7];
}
else {
vErrors.push(err7);
}
errors++;
}
}
}
}
var _valid2 = _errs61 === errors;
errors = _errs60;
if(vErrors !== null){
if(_errs60){
vErrors.length = _errs60;
}
else {
vErrors = null;
}
}
if(_valid2){
const _errs63 = errors;
if(errors === _errs63){
if(data12 && typeof data12 == "object" && !Array.isArray(data12)){
let missing6;
if((((((data12.kind === undefined) && (missing6 = "kind")) || ((data12.diameter_m === undefined) && (missing6 = "diameter_m"))) || ((data12.u_diameter_m === undefined) && (missing6 = "u_diameter_m"))) || ((data12.thickness_m === undefined) && (missing6 = "thickness_m"))) || ((data12.u_thickness_m === undefined) && (missing6 = "u_thickness_m"))){
validate26.errors = [{instancePath:instancePath+"/shape",schemaPath:"#/properties/shape/allOf/2/then/required",keyword:"required",params:{missingProperty: missing6},message:"must have required property '"+missing6+"'"}];
return false;
}
else {
const _errs65 = errors;
for(const key3 in data12){
if(!(((((key3 === "kind") || (key3 === "diameter_m")) || (key3 === "u_diameter_m")) || (key3 === "thickness_m")) || (key3 === "u_thickness_m"))){
validate26.errors = [{instancePath:instancePath+"/shape",schemaPath:"#/properties/shape/allOf/2/then/additionalProperties",keyword:"additionalProperties",params:{additionalProperty: key3},message:"must NOT have additional properties"}];
return false;
break;
}
}
if(_errs65 === errors){
if(data12.kind !== undefined){
const _errs66 = errors;
if("disc" !== data12.kind){
validate26.errors = [{instancePath:instancePath+"/shape/kind",schemaPath:"#/properties/shape/allOf/2/then/properties/kind/const",keyword:"const",params:{allowedValue: "disc"},message:"must be equal to constant"}];
return false;
}
var valid16 = _errs66 === errors;
}
else {
var valid16 = true;
}
if(valid16){
if(data12.diameter_m !== undefined){
let data25 = data12.diameter_m;
const _errs67 = errors;
if(errors === _errs67){
if((typeof data25 == "number") && (isFinite(data25))){
if(data25 > 20 || isNaN(data25)){
validate26.errors = [{instancePath:instancePath+"/shape/diameter_m",schemaPath:"#/properties/shape/allOf/2/then/properties/diameter_m/maximum",keyword:"maximum",params:{comparison: "<=", limit: 20},message:"must be <= 20"}];
return false;
}
else {
if(data25 <= 0 || isNaN(data25)){
validate26.errors = [{instancePath:instancePath+"/shape/diameter_m",schemaPath:"#/properties/shape/allOf/2/then/properties/diameter_m/exclusiveMinimum",keyword:"exclusiveMinimum",params:{comparison: ">", limit: 0},message:"must be > 0"}];
return false;
}
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape/diameter_m",schemaPath:"#/properties/shape/allOf/2/then/properties/diameter_m/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid16 = _errs67 === errors;
}
else {
var valid16 = true;
}
if(valid16){
if(data12.u_diameter_m !== undefined){
let data26 = data12.u_diameter_m;
const _errs69 = errors;
if(errors === _errs69){
if((typeof data26 == "number") && (isFinite(data26))){
if(data26 < 0 || isNaN(data26)){
validate26.errors = [{instancePath:instancePath+"/shape/u_diameter_m",schemaPath:"#/properties/shape/allOf/2/then/properties/u_diameter_m/minimum",keyword:"minimum",params:{comparison: ">=", limit: 0},message:"must be >= 0"}];
return false;
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape/u_diameter_m",schemaPath:"#/properties/shape/allOf/2/then/properties/u_diameter_m/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid16 = _errs69 === errors;
}
else {
var valid16 = true;
}
if(valid16){
if(data12.thickness_m !== undefined){
let data27 = data12.thickness_m;
const _errs71 = errors;
if(errors === _errs71){
if((typeof data27 == "number") && (isFinite(data27))){
if(data27 > 20 || isNaN(data27)){
validate26.errors = [{instancePath:instancePath+"/shape/thickness_m",schemaPath:"#/properties/shape/allOf/2/then/properties/thickness_m/maximum",keyword:"maximum",params:{comparison: "<=", limit: 20},message:"must be <= 20"}];
return false;
}
else {
if(data27 <= 0 || isNaN(data27)){
validate26.errors = [{instancePath:instancePath+"/shape/thickness_m",schemaPath:"#/properties/shape/allOf/2/then/properties/thickness_m/exclusiveMinimum",keyword:"exclusiveMinimum",params:{comparison: ">", limit: 0},message:"must be > 0"}];
return false;
}
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape/thickness_m",schemaPath:"#/properties/shape/allOf/2/then/properties/thickness_m/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid16 = _errs71 === errors;
}
else {
var valid16 = true;
}
if(valid16){
if(data12.u_thickness_m !== undefined){
let data28 = data12.u_thickness_m;
const _errs73 = errors;
if(errors === _errs73){
if((typeof data28 == "number") && (isFinite(data28))){
if(data28 < 0 || isNaN(data28)){
validate26.errors = [{instancePath:instancePath+"/shape/u_thickness_m",schemaPath:"#/properties/shape/allOf/2/then/properties/u_thickness_m/minimum",keyword:"minimum",params:{comparison: ">=", limit: 0},message:"must be >= 0"}];
return false;
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape/u_thickness_m",schemaPath:"#/properties/shape/allOf/2/then/properties/u_thickness_m/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid16 = _errs73 === errors;
}
else {
var valid16 = true;
}
}
}
}
}
}
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape",schemaPath:"#/properties/shape/allOf/2/then/type",keyword:"type",params:{type: "object"},message:"must be object"}];
return false;
}
}
var _valid2 = _errs63 === errors;
valid14 = _valid2;
if(valid14){
var props2 = true;
}
}
if(!valid14){
const err8 = {instancePath:instancePath+"/shape",schemaPath:"#/properties/shape/allOf/2/if",keyword:"if",params:{failingKeyword: "then"},message:"must match \"then\" schema"};
if(vErrors === null){
vErrors = [err8];
}
else {
vErrors.push(err8);
}
errors++;
validate26.errors = vErrors;
return false;
}
var valid7 = _errs59 === errors;
if(valid7){
if(props0 !== true && props2 !== undefined){
if(props2 === true){
props0 = true;
}
else {
props0 = props0 || {};
Object.assign(props0, props2);
}
}
const _errs75 = errors;
const _errs76 = errors;
let valid17 = true;
const _errs77 = errors;
if(data12 && typeof data12 == "object" && !Array.isArray(data12)){
let missing7;
if((data12.kind === undefined) && (missing7 = "kind")){
const err9 = {};
if(vErrors === null){
vErrors = [err9];
}
else {
vErrors.push(err9);
}
errors++;
}
else {
if(data12.kind !== undefined){
if("box" !== data12.kind){
const err10 = {};
if(vErrors === null){
vErrors = [err10];
}
else {
vErrors.push(err10);
}
errors++;
}
}
}
}
var _valid3 = _errs77 === errors;
errors = _errs76;
if(vErrors !== null){
if(_errs76){
vErrors.length = _errs76;
}
else {
vErrors = null;
}
}
if(_valid3){
const _errs79 = errors;
if(errors === _errs79){
if(data12 && typeof data12 == "object" && !Array.isArray(data12)){
let missing8;
if((((((((data12.kind === undefined) && (missing8 = "kind")) || ((data12.length_m === undefined) && (missing8 = "length_m"))) || ((data12.u_length_m === undefined) && (missing8 = "u_length_m"))) || ((data12.width_m === undefined) && (missing8 = "width_m"))) || ((data12.u_width_m === undefined) && (missing8 = "u_width_m"))) || ((data12.height_m === undefined) && (missing8 = "height_m"))) || ((data12.u_height_m === undefined) && (missing8 = "u_height_m"))){
validate26.errors = [{instancePath:instancePath+"/shape",schemaPath:"#/properties/shape/allOf/3/then/required",keyword:"required",params:{missingProperty: missing8},message:"must have required property '"+missing8+"'"}];
return false;
}
else {
const _errs81 = errors;
for(const key4 in data12){
if(!(((((((key4 === "kind") || (key4 === "length_m")) || (key4 === "u_length_m")) || (key4 === "width_m")) || (key4 === "u_width_m")) || (key4 === "height_m")) || (key4 === "u_height_m"))){
validate26.errors = [{instancePath:instancePath+"/shape",schemaPath:"#/properties/shape/allOf/3/then/additionalProperties",keyword:"additionalProperties",params:{additionalProperty: key4},message:"must NOT have additional properties"}];
return false;
break;
}
}
if(_errs81 === errors){
if(data12.kind !== undefined){
const _errs82 = errors;
if("box" !== data12.kind){
validate26.errors = [{instancePath:instancePath+"/shape/kind",schemaPath:"#/properties/shape/allOf/3/then/properties/kind/const",keyword:"const",params:{allowedValue: "box"},message:"must be equal to constant"}];
return false;
}
var valid19 = _errs82 === errors;
}
else {
var valid19 = true;
}
if(valid19){
if(data12.length_m !== undefined){
let data31 = data12.length_m;
const _errs83 = errors;
if(errors === _errs83){
if((typeof data31 == "number") && (isFinite(data31))){
if(data31 > 20 || isNaN(data31)){
validate26.errors = [{instancePath:instancePath+"/shape/length_m",schemaPath:"#/properties/shape/allOf/3/then/properties/length_m/maximum",keyword:"maximum",params:{comparison: "<=", limit: 20},message:"must be <= 20"}];
return false;
}
else {
if(data31 <= 0 || isNaN(data31)){
validate26.errors = [{instancePath:instancePath+"/shape/length_m",schemaPath:"#/properties/shape/allOf/3/then/properties/length_m/exclusiveMinimum",keyword:"exclusiveMinimum",params:{comparison: ">", limit: 0},message:"must be > 0"}];
return false;
}
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape/length_m",schemaPath:"#/properties/shape/allOf/3/then/properties/length_m/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid19 = _errs83 === errors;
}
else {
var valid19 = true;
}
if(valid19){
if(data12.u_length_m !== undefined){
let data32 = data12.u_length_m;
const _errs85 = errors;
if(errors === _errs85){
if((typeof data32 == "number") && (isFinite(data32))){
if(data32 < 0 || isNaN(data32)){
validate26.errors = [{instancePath:instancePath+"/shape/u_length_m",schemaPath:"#/properties/shape/allOf/3/then/properties/u_length_m/minimum",keyword:"minimum",params:{comparison: ">=", limit: 0},message:"must be >= 0"}];
return false;
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape/u_length_m",schemaPath:"#/properties/shape/allOf/3/then/properties/u_length_m/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid19 = _errs85 === errors;
}
else {
var valid19 = true;
}
if(valid19){
if(data12.width_m !== undefined){
let data33 = data12.width_m;
const _errs87 = errors;
if(errors === _errs87){
if((typeof data33 == "number") && (isFinite(data33))){
if(data33 > 20 || isNaN(data33)){
validate26.errors = [{instancePath:instancePath+"/shape/width_m",schemaPath:"#/properties/shape/allOf/3/then/properties/width_m/maximum",keyword:"maximum",params:{comparison: "<=", limit: 20},message:"must be <= 20"}];
return false;
}
else {
if(data33 <= 0 || isNaN(data33)){
validate26.errors = [{instancePath:instancePath+"/shape/width_m",schemaPath:"#/properties/shape/allOf/3/then/properties/width_m/exclusiveMinimum",keyword:"exclusiveMinimum",params:{comparison: ">", limit: 0},message:"must be > 0"}];
return false;
}
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape/width_m",schemaPath:"#/properties/shape/allOf/3/then/properties/width_m/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid19 = _errs87 === errors;
}
else {
var valid19 = true;
}
if(valid19){
if(data12.u_width_m !== undefined){
let data34 = data12.u_width_m;
const _errs89 = errors;
if(errors === _errs89){
if((typeof data34 == "number") && (isFinite(data34))){
if(data34 < 0 || isNaN(data34)){
validate26.errors = [{instancePath:instancePath+"/shape/u_width_m",schemaPath:"#/properties/shape/allOf/3/then/properties/u_width_m/minimum",keyword:"minimum",params:{comparison: ">=", limit: 0},message:"must be >= 0"}];
return false;
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape/u_width_m",schemaPath:"#/properties/shape/allOf/3/then/properties/u_width_m/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid19 = _errs89 === errors;
}
else {
var valid19 = true;
}
if(valid19){
if(data12.height_m !== undefined){
let data35 = data12.height_m;
const _errs91 = errors;
if(errors === _errs91){
if((typeof data35 == "number") && (isFinite(data35))){
if(data35 > 20 || isNaN(data35)){
validate26.errors = [{instancePath:instancePath+"/shape/height_m",schemaPath:"#/properties/shape/allOf/3/then/properties/height_m/maximum",keyword:"maximum",params:{comparison: "<=", limit: 20},message:"must be <= 20"}];
return false;
}
else {
if(data35 <= 0 || isNaN(data35)){
validate26.errors = [{instancePath:instancePath+"/shape/height_m",schemaPath:"#/properties/shape/allOf/3/then/properties/height_m/exclusiveMinimum",keyword:"exclusiveMinimum",params:{comparison: ">", limit: 0},message:"must be > 0"}];
return false;
}
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape/height_m",schemaPath:"#/properties/shape/allOf/3/then/properties/height_m/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid19 = _errs91 === errors;
}
else {
var valid19 = true;
}
if(valid19){
if(data12.u_height_m !== undefined){
let data36 = data12.u_height_m;
const _errs93 = errors;
if(errors === _errs93){
if((typeof data36 == "number") && (isFinite(data36))){
if(data36 < 0 || isNaN(data36)){
validate26.errors = [{instancePath:instancePath+"/shape/u_height_m",schemaPath:"#/properties/shape/allOf/3/then/properties/u_height_m/minimum",keyword:"minimum",params:{comparison: ">=", limit: 0},message:"must be >= 0"}];
return false;
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape/u_height_m",schemaPath:"#/properties/shape/allOf/3/then/properties/u_height_m/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid19 = _errs93 === errors;
}
else {
var valid19 = true;
}
}
}
}
}
}
}
}
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape",schemaPath:"#/properties/shape/allOf/3/then/type",keyword:"type",params:{type: "object"},message:"must be object"}];
return false;
}
}
var _valid3 = _errs79 === errors;
valid17 = _valid3;
if(valid17){
var props3 = true;
}
}
if(!valid17){
const err11 = {instancePath:instancePath+"/shape",schemaPath:"#/properties/shape/allOf/3/if",keyword:"if",params:{failingKeyword: "then"},message:"must match \"then\" schema"};
if(vErrors === null){
vErrors = [err11];
}
else {
vErrors.push(err11);
}
errors++;
validate26.errors = vErrors;
return false;
}
var valid7 = _errs75 === errors;
if(valid7){
if(props0 !== true && props3 !== undefined){
if(props3 === true){
props0 = true;
}
else {
props0 = props0 || {};
Object.assign(props0, props3);
}
}
const _errs95 = errors;
const _errs96 = errors;
let valid20 = true;
const _errs97 = errors;
if(data12 && typeof data12 == "object" && !Array.isArray(data12)){
let missing9;
if((data12.kind === undefined) && (missing9 = "kind")){
const err12 = {};
if(vErrors === null){
vErrors = [err12];
}
else {
vErrors.push(err12);
}
errors++;
}
else {
if(data12.kind !== undefined){
if("custom" !== data12.kind){
const err13 = {};
if(vErrors === null){
vErrors = [err13];
}
else {
vErrors.push(err13);
}
errors++;
}
}
}
}
var _valid4 = _errs97 === errors;
errors = _errs96;
if(vErrors !== null){
if(_errs96){
vErrors.length = _errs96;
}
else {
vErrors = null;
}
}
if(_valid4){
const _errs99 = errors;
if(errors === _errs99){
if(data12 && typeof data12 == "object" && !Array.isArray(data12)){
let missing10;
if((((((data12.kind === undefined) && (missing10 = "kind")) || ((data12.area_m2 === undefined) && (missing10 = "area_m2"))) || ((data12.u_area_m2 === undefined) && (missing10 = "u_area_m2"))) || ((data12.volume_m3 === undefined) && (missing10 = "volume_m3"))) || ((data12.u_volume_m3 === undefined) && (missing10 = "u_volume_m3"))){
validate26.errors = [{instancePath:instancePath+"/shape",schemaPath:"#/properties/shape/allOf/4/then/required",keyword:"required",params:{missingProperty: missing10},message:"must have required property '"+missing10+"'"}];
return false;
}
else {
const _errs101 = errors;
for(const key5 in data12){
if(!(((((key5 === "kind") || (key5 === "area_m2")) || (key5 === "u_area_m2")) || (key5 === "volume_m3")) || (key5 === "u_volume_m3"))){
validate26.errors = [{instancePath:instancePath+"/shape",schemaPath:"#/properties/shape/allOf/4/then/additionalProperties",keyword:"additionalProperties",params:{additionalProperty: key5},message:"must NOT have additional properties"}];
return false;
break;
}
}
if(_errs101 === errors){
if(data12.kind !== undefined){
const _errs102 = errors;
if("custom" !== data12.kind){
validate26.errors = [{instancePath:instancePath+"/shape/kind",schemaPath:"#/properties/shape/allOf/4/then/properties/kind/const",keyword:"const",params:{allowedValue: "custom"},message:"must be equal to constant"}];
return false;
}
var valid22 = _errs102 === errors;
}
else {
var valid22 = true;
}
if(valid22){
if(data12.area_m2 !== undefined){
let data39 = data12.area_m2;
const _errs103 = errors;
if(errors === _errs103){
if((typeof data39 == "number") && (isFinite(data39))){
if(data39 > 1000 || isNaN(data39)){
validate26.errors = [{instancePath:instancePath+"/shape/area_m2",schemaPath:"#/properties/shape/allOf/4/then/properties/area_m2/maximum",keyword:"maximum",params:{comparison: "<=", limit: 1000},message:"must be <= 1000"}];
return false;
}
else {
if(data39 <= 0 || isNaN(data39)){
validate26.errors = [{instancePath:instancePath+"/shape/area_m2",schemaPath:"#/properties/shape/allOf/4/then/properties/area_m2/exclusiveMinimum",keyword:"exclusiveMinimum",params:{comparison: ">", limit: 0},message:"must be > 0"}];
return false;
}
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape/area_m2",schemaPath:"#/properties/shape/allOf/4/then/properties/area_m2/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid22 = _errs103 === errors;
}
else {
var valid22 = true;
}
if(valid22){
if(data12.u_area_m2 !== undefined){
let data40 = data12.u_area_m2;
const _errs105 = errors;
if(errors === _errs105){
if((typeof data40 == "number") && (isFinite(data40))){
if(data40 < 0 || isNaN(data40)){
validate26.errors = [{instancePath:instancePath+"/shape/u_area_m2",schemaPath:"#/properties/shape/allOf/4/then/properties/u_area_m2/minimum",keyword:"minimum",params:{comparison: ">=", limit: 0},message:"must be >= 0"}];
return false;
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape/u_area_m2",schemaPath:"#/properties/shape/allOf/4/then/properties/u_area_m2/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid22 = _errs105 === errors;
}
else {
var valid22 = true;
}
if(valid22){
if(data12.volume_m3 !== undefined){
let data41 = data12.volume_m3;
const _errs107 = errors;
if(errors === _errs107){
if((typeof data41 == "number") && (isFinite(data41))){
if(data41 > 1000 || isNaN(data41)){
validate26.errors = [{instancePath:instancePath+"/shape/volume_m3",schemaPath:"#/properties/shape/allOf/4/then/properties/volume_m3/maximum",keyword:"maximum",params:{comparison: "<=", limit: 1000},message:"must be <= 1000"}];
return false;
}
else {
if(data41 <= 0 || isNaN(data41)){
validate26.errors = [{instancePath:instancePath+"/shape/volume_m3",schemaPath:"#/properties/shape/allOf/4/then/properties/volume_m3/exclusiveMinimum",keyword:"exclusiveMinimum",params:{comparison: ">", limit: 0},message:"must be > 0"}];
return false;
}
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape/volume_m3",schemaPath:"#/properties/shape/allOf/4/then/properties/volume_m3/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid22 = _errs107 === errors;
}
else {
var valid22 = true;
}
if(valid22){
if(data12.u_volume_m3 !== undefined){
let data42 = data12.u_volume_m3;
const _errs109 = errors;
if(errors === _errs109){
if((typeof data42 == "number") && (isFinite(data42))){
if(data42 < 0 || isNaN(data42)){
validate26.errors = [{instancePath:instancePath+"/shape/u_volume_m3",schemaPath:"#/properties/shape/allOf/4/then/properties/u_volume_m3/minimum",keyword:"minimum",params:{comparison: ">=", limit: 0},message:"must be >= 0"}];
return false;
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape/u_volume_m3",schemaPath:"#/properties/shape/allOf/4/then/properties/u_volume_m3/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid22 = _errs109 === errors;
}
else {
var valid22 = true;
}
}
}
}
}
}
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape",schemaPath:"#/properties/shape/allOf/4/then/type",keyword:"type",params:{type: "object"},message:"must be object"}];
return false;
}
}
var _valid4 = _errs99 === errors;
valid20 = _valid4;
if(valid20){
var props4 = true;
}
}
if(!valid20){
const err14 = {instancePath:instancePath+"/shape",schemaPath:"#/properties/shape/allOf/4/if",keyword:"if",params:{failingKeyword: "then"},message:"must match \"then\" schema"};
if(vErrors === null){
vErrors = [err14];
}
else {
vErrors.push(err14);
}
errors++;
validate26.errors = vErrors;
return false;
}
var valid7 = _errs95 === errors;
if(valid7){
if(props0 !== true && props4 !== undefined){
if(props4 === true){
props0 = true;
}
else {
props0 = props0 || {};
Object.assign(props0, props4);
}
}
}
}
}
}
}
if(errors === _errs29){
if(data12 && typeof data12 == "object" && !Array.isArray(data12)){
let missing11;
if((data12.kind === undefined) && (missing11 = "kind")){
validate26.errors = [{instancePath:instancePath+"/shape",schemaPath:"#/properties/shape/required",keyword:"required",params:{missingProperty: missing11},message:"must have required property '"+missing11+"'"}];
return false;
}
else {
if(props0 !== true){
props0 = props0 || {};
props0.kind = true;
}
if(data12.kind !== undefined){
let data43 = data12.kind;
if(typeof data43 !== "string"){
validate26.errors = [{instancePath:instancePath+"/shape/kind",schemaPath:"#/properties/shape/properties/kind/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
if(!(((((data43 === "sphere") || (data43 === "cylinder")) || (data43 === "disc")) || (data43 === "box")) || (data43 === "custom"))){
validate26.errors = [{instancePath:instancePath+"/shape/kind",schemaPath:"#/properties/shape/properties/kind/enum",keyword:"enum",params:{allowedValues: schema47.properties.shape.properties.kind.enum},message:"must be equal to one of the allowed values"}];
return false;
}
}
}
}
else {
validate26.errors = [{instancePath:instancePath+"/shape",schemaPath:"#/properties/shape/type",keyword:"type",params:{type: "object"},message:"must be object"}];
return false;
}
}
var valid0 = _errs29 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.reference_drag_coefficient !== undefined){
let data44 = data.reference_drag_coefficient;
const _errs113 = errors;
const _errs114 = errors;
let valid24 = false;
const _errs115 = errors;
if(errors === _errs115){
if((typeof data44 == "number") && (isFinite(data44))){
if(data44 > 5 || isNaN(data44)){
const err15 = {instancePath:instancePath+"/reference_drag_coefficient",schemaPath:"#/properties/reference_drag_coefficient/anyOf/0/maximum",keyword:"maximum",params:{comparison: "<=", limit: 5},message:"must be <= 5"};
if(vErrors === null){
vErrors = [err15];
}
else {
vErrors.push(err15);
}
errors++;
}
else {
if(data44 <= 0 || isNaN(data44)){
const err16 = {instancePath:instancePath+"/reference_drag_coefficient",schemaPath:"#/properties/reference_drag_coefficient/anyOf/0/exclusiveMinimum",keyword:"exclusiveMinimum",params:{comparison: ">", limit: 0},message:"must be > 0"};
if(vErrors === null){
vErrors = [err16];
}
else {
vErrors.push(err16);
}
errors++;
}
}
}
else {
const err17 = {instancePath:instancePath+"/reference_drag_coefficient",schemaPath:"#/properties/reference_drag_coefficient/anyOf/0/type",keyword:"type",params:{type: "number"},message:"must be number"};
if(vErrors === null){
vErrors = [err17];
}
else {
vErrors.push(err17);
}
errors++;
}
}
var _valid5 = _errs115 === errors;
valid24 = valid24 || _valid5;
const _errs117 = errors;
if(data44 !== null){
const err18 = {instancePath:instancePath+"/reference_drag_coefficient",schemaPath:"#/properties/reference_drag_coefficient/anyOf/1/type",keyword:"type",params:{type: "null"},message:"must be null"};
if(vErrors === null){
vErrors = [err18];
}
else {
vErrors.push(err18);
}
errors++;
}
var _valid5 = _errs117 === errors;
valid24 = valid24 || _valid5;
if(!valid24){
const err19 = {instancePath:instancePath+"/reference_drag_coefficient",schemaPath:"#/properties/reference_drag_coefficient/anyOf",keyword:"anyOf",params:{},message:"must match a schema in anyOf"};
if(vErrors === null){
vErrors = [err19];
}
else {
vErrors.push(err19);
}
errors++;
validate26.errors = vErrors;
return false;
}
else {
errors = _errs114;
if(vErrors !== null){
if(_errs114){
vErrors.length = _errs114;
}
else {
vErrors = null;
}
}
}
var valid0 = _errs113 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.notes !== undefined){
const _errs119 = errors;
if(typeof data.notes !== "string"){
validate26.errors = [{instancePath:instancePath+"/notes",schemaPath:"#/properties/notes/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
var valid0 = _errs119 === errors;
}
else {
var valid0 = true;
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
else {
validate26.errors = [{instancePath,schemaPath:"#/type",keyword:"type",params:{type: "object"},message:"must be object"}];
return false;
}
}
validate26.errors = vErrors;
return errors === 0;
}
validate26.evaluated = {"props":true,"dynamicProps":false,"dynamicItems":false};

const schema53 = {"type":"object","required":["id","kind","created_at","updated_at","rev","device","deleted","history","site_id","date","crew","notes"],"properties":{"id":{"$ref":"#/$defs/id"},"kind":{"const":"day"},"created_at":{"$ref":"#/$defs/instant"},"updated_at":{"$ref":"#/$defs/instant"},"rev":{"$ref":"#/$defs/rev"},"device":{"$ref":"#/$defs/device"},"deleted":{"type":"boolean","description":"A deleted record stays as a tombstone so the deletion travels."},"history":{"type":"array","items":{"$ref":"#/$defs/revision"},"description":"Earlier versions, oldest first."},"site_id":{"$ref":"#/$defs/id"},"date":{"$ref":"#/$defs/date"},"crew":{"type":"array","items":{"type":"string"}},"notes":{"type":"string"}},"additionalProperties":false};
const schema60 = {"type":"string","pattern":"^\\d{4}-\\d{2}-\\d{2}$","description":"A calendar date, YYYY-MM-DD."};
const pattern27 = new RegExp("^\\d{4}-\\d{2}-\\d{2}$", "u");

function validate29(data, {instancePath="", parentData, parentDataProperty, rootData=data, dynamicAnchors={}}={}){
let vErrors = null;
let errors = 0;
const evaluated0 = validate29.evaluated;
if(evaluated0.dynamicProps){
evaluated0.props = undefined;
}
if(evaluated0.dynamicItems){
evaluated0.items = undefined;
}
if(errors === 0){
if(data && typeof data == "object" && !Array.isArray(data)){
let missing0;
if(((((((((((((data.id === undefined) && (missing0 = "id")) || ((data.kind === undefined) && (missing0 = "kind"))) || ((data.created_at === undefined) && (missing0 = "created_at"))) || ((data.updated_at === undefined) && (missing0 = "updated_at"))) || ((data.rev === undefined) && (missing0 = "rev"))) || ((data.device === undefined) && (missing0 = "device"))) || ((data.deleted === undefined) && (missing0 = "deleted"))) || ((data.history === undefined) && (missing0 = "history"))) || ((data.site_id === undefined) && (missing0 = "site_id"))) || ((data.date === undefined) && (missing0 = "date"))) || ((data.crew === undefined) && (missing0 = "crew"))) || ((data.notes === undefined) && (missing0 = "notes"))){
validate29.errors = [{instancePath,schemaPath:"#/required",keyword:"required",params:{missingProperty: missing0},message:"must have required property '"+missing0+"'"}];
return false;
}
else {
const _errs1 = errors;
for(const key0 in data){
if(!(func1.call(schema53.properties, key0))){
validate29.errors = [{instancePath,schemaPath:"#/additionalProperties",keyword:"additionalProperties",params:{additionalProperty: key0},message:"must NOT have additional properties"}];
return false;
break;
}
}
if(_errs1 === errors){
if(data.id !== undefined){
let data0 = data.id;
const _errs2 = errors;
const _errs3 = errors;
if(errors === _errs3){
if(typeof data0 === "string"){
if(!pattern5.test(data0)){
validate29.errors = [{instancePath:instancePath+"/id",schemaPath:"#/$defs/id/pattern",keyword:"pattern",params:{pattern: "^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"},message:"must match pattern \""+"^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"+"\""}];
return false;
}
}
else {
validate29.errors = [{instancePath:instancePath+"/id",schemaPath:"#/$defs/id/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs2 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.kind !== undefined){
const _errs5 = errors;
if("day" !== data.kind){
validate29.errors = [{instancePath:instancePath+"/kind",schemaPath:"#/properties/kind/const",keyword:"const",params:{allowedValue: "day"},message:"must be equal to constant"}];
return false;
}
var valid0 = _errs5 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.created_at !== undefined){
let data2 = data.created_at;
const _errs6 = errors;
const _errs7 = errors;
if(errors === _errs7){
if(typeof data2 === "string"){
if(!pattern9.test(data2)){
validate29.errors = [{instancePath:instancePath+"/created_at",schemaPath:"#/$defs/instant/pattern",keyword:"pattern",params:{pattern: "^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"},message:"must match pattern \""+"^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"+"\""}];
return false;
}
}
else {
validate29.errors = [{instancePath:instancePath+"/created_at",schemaPath:"#/$defs/instant/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs6 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.updated_at !== undefined){
let data3 = data.updated_at;
const _errs9 = errors;
const _errs10 = errors;
if(errors === _errs10){
if(typeof data3 === "string"){
if(!pattern9.test(data3)){
validate29.errors = [{instancePath:instancePath+"/updated_at",schemaPath:"#/$defs/instant/pattern",keyword:"pattern",params:{pattern: "^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"},message:"must match pattern \""+"^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"+"\""}];
return false;
}
}
else {
validate29.errors = [{instancePath:instancePath+"/updated_at",schemaPath:"#/$defs/instant/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs9 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.rev !== undefined){
let data4 = data.rev;
const _errs12 = errors;
const _errs13 = errors;
if(errors === _errs13){
if(typeof data4 === "string"){
if(!pattern11.test(data4)){
validate29.errors = [{instancePath:instancePath+"/rev",schemaPath:"#/$defs/rev/pattern",keyword:"pattern",params:{pattern: "^\\d{15}-\\d{6}-[A-Za-z0-9_.:]+$"},message:"must match pattern \""+"^\\d{15}-\\d{6}-[A-Za-z0-9_.:]+$"+"\""}];
return false;
}
}
else {
validate29.errors = [{instancePath:instancePath+"/rev",schemaPath:"#/$defs/rev/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs12 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.device !== undefined){
let data5 = data.device;
const _errs15 = errors;
const _errs16 = errors;
if(errors === _errs16){
if(typeof data5 === "string"){
if(!pattern4.test(data5)){
validate29.errors = [{instancePath:instancePath+"/device",schemaPath:"#/$defs/device/pattern",keyword:"pattern",params:{pattern: "^[A-Za-z0-9_.:]+$"},message:"must match pattern \""+"^[A-Za-z0-9_.:]+$"+"\""}];
return false;
}
}
else {
validate29.errors = [{instancePath:instancePath+"/device",schemaPath:"#/$defs/device/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs15 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.deleted !== undefined){
const _errs18 = errors;
if(typeof data.deleted !== "boolean"){
validate29.errors = [{instancePath:instancePath+"/deleted",schemaPath:"#/properties/deleted/type",keyword:"type",params:{type: "boolean"},message:"must be boolean"}];
return false;
}
var valid0 = _errs18 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.history !== undefined){
let data7 = data.history;
const _errs20 = errors;
if(errors === _errs20){
if(Array.isArray(data7)){
var valid6 = true;
const len0 = data7.length;
for(let i0=0; i0<len0; i0++){
const _errs22 = errors;
if(!(validate23(data7[i0], {instancePath:instancePath+"/history/" + i0,parentData:data7,parentDataProperty:i0,rootData,dynamicAnchors}))){
vErrors = vErrors === null ? validate23.errors : vErrors.concat(validate23.errors);
errors = vErrors.length;
}
var valid6 = _errs22 === errors;
if(!valid6){
break;
}
}
}
else {
validate29.errors = [{instancePath:instancePath+"/history",schemaPath:"#/properties/history/type",keyword:"type",params:{type: "array"},message:"must be array"}];
return false;
}
}
var valid0 = _errs20 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.site_id !== undefined){
let data9 = data.site_id;
const _errs23 = errors;
const _errs24 = errors;
if(errors === _errs24){
if(typeof data9 === "string"){
if(!pattern5.test(data9)){
validate29.errors = [{instancePath:instancePath+"/site_id",schemaPath:"#/$defs/id/pattern",keyword:"pattern",params:{pattern: "^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"},message:"must match pattern \""+"^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"+"\""}];
return false;
}
}
else {
validate29.errors = [{instancePath:instancePath+"/site_id",schemaPath:"#/$defs/id/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs23 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.date !== undefined){
let data10 = data.date;
const _errs26 = errors;
const _errs27 = errors;
if(errors === _errs27){
if(typeof data10 === "string"){
if(!pattern27.test(data10)){
validate29.errors = [{instancePath:instancePath+"/date",schemaPath:"#/$defs/date/pattern",keyword:"pattern",params:{pattern: "^\\d{4}-\\d{2}-\\d{2}$"},message:"must match pattern \""+"^\\d{4}-\\d{2}-\\d{2}$"+"\""}];
return false;
}
}
else {
validate29.errors = [{instancePath:instancePath+"/date",schemaPath:"#/$defs/date/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs26 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.crew !== undefined){
let data11 = data.crew;
const _errs29 = errors;
if(errors === _errs29){
if(Array.isArray(data11)){
var valid9 = true;
const len1 = data11.length;
for(let i1=0; i1<len1; i1++){
const _errs31 = errors;
if(typeof data11[i1] !== "string"){
validate29.errors = [{instancePath:instancePath+"/crew/" + i1,schemaPath:"#/properties/crew/items/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
var valid9 = _errs31 === errors;
if(!valid9){
break;
}
}
}
else {
validate29.errors = [{instancePath:instancePath+"/crew",schemaPath:"#/properties/crew/type",keyword:"type",params:{type: "array"},message:"must be array"}];
return false;
}
}
var valid0 = _errs29 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.notes !== undefined){
const _errs33 = errors;
if(typeof data.notes !== "string"){
validate29.errors = [{instancePath:instancePath+"/notes",schemaPath:"#/properties/notes/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
var valid0 = _errs33 === errors;
}
else {
var valid0 = true;
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
else {
validate29.errors = [{instancePath,schemaPath:"#/type",keyword:"type",params:{type: "object"},message:"must be object"}];
return false;
}
}
validate29.errors = vErrors;
return errors === 0;
}
validate29.evaluated = {"props":true,"dynamicProps":false,"dynamicItems":false};

const schema61 = {"type":"object","required":["id","kind","created_at","updated_at","rev","device","deleted","history","day_id","taken_at","temperature_C","u_temperature_C","pressure_Pa","u_pressure_Pa","pressure_reference","humidity","wind_speed_m_s","instrument","notes"],"properties":{"id":{"$ref":"#/$defs/id"},"kind":{"const":"reading"},"created_at":{"$ref":"#/$defs/instant"},"updated_at":{"$ref":"#/$defs/instant"},"rev":{"$ref":"#/$defs/rev"},"device":{"$ref":"#/$defs/device"},"deleted":{"type":"boolean","description":"A deleted record stays as a tombstone so the deletion travels."},"history":{"type":"array","items":{"$ref":"#/$defs/revision"},"description":"Earlier versions, oldest first."},"day_id":{"$ref":"#/$defs/id"},"taken_at":{"$ref":"#/$defs/instant"},"temperature_C":{"type":"number","minimum":-90,"maximum":60},"u_temperature_C":{"type":"number","minimum":0,"maximum":10},"pressure_Pa":{"type":"number","description":"Station or sea-level pressure, as pressure_reference says."},"u_pressure_Pa":{"type":"number","minimum":0,"maximum":5000},"pressure_reference":{"type":"string","enum":["station","sea_level"]},"humidity":{"type":"object","description":"Relative humidity or dew point.","required":["kind"],"properties":{"kind":{"type":"string","enum":["relative","dew_point"]}},"allOf":[{"if":{"properties":{"kind":{"const":"relative"}},"required":["kind"]},"then":{"type":"object","required":["kind","relative_humidity_pct","u_relative_humidity_pct"],"properties":{"kind":{"const":"relative"},"relative_humidity_pct":{"type":"number","minimum":0,"maximum":100},"u_relative_humidity_pct":{"type":"number","minimum":0,"maximum":100}},"additionalProperties":false}},{"if":{"properties":{"kind":{"const":"dew_point"}},"required":["kind"]},"then":{"type":"object","required":["kind","dew_point_C","u_dew_point_C"],"properties":{"kind":{"const":"dew_point"},"dew_point_C":{"type":"number","minimum":-90,"maximum":60},"u_dew_point_C":{"type":"number","minimum":0,"maximum":10}},"additionalProperties":false}}]},"wind_speed_m_s":{"anyOf":[{"type":"number","minimum":0,"maximum":75},{"type":"null"}]},"instrument":{"type":"string"},"notes":{"type":"string"}},"additionalProperties":false,"if":{"properties":{"pressure_reference":{"const":"sea_level"}},"required":["pressure_reference"]},"then":{"properties":{"pressure_Pa":{"type":"number","minimum":85000,"maximum":110000}}},"else":{"properties":{"pressure_Pa":{"type":"number","minimum":30000,"maximum":110000}}}};

function validate32(data, {instancePath="", parentData, parentDataProperty, rootData=data, dynamicAnchors={}}={}){
let vErrors = null;
let errors = 0;
const evaluated0 = validate32.evaluated;
if(evaluated0.dynamicProps){
evaluated0.props = undefined;
}
if(evaluated0.dynamicItems){
evaluated0.items = undefined;
}
const _errs1 = errors;
let valid0 = true;
const _errs2 = errors;
if(data && typeof data == "object" && !Array.isArray(data)){
let missing0;
if((data.pressure_reference === undefined) && (missing0 = "pressure_reference")){
const err0 = {};
if(vErrors === null){
vErrors = [err0];
}
else {
vErrors.push(err0);
}
errors++;
}
else {
if(data.pressure_reference !== undefined){
if("sea_level" !== data.pressure_reference){
const err1 = {};
if(vErrors === null){
vErrors = [err1];
}
else {
vErrors.push(err1);
}
errors++;
}
}
}
}
var _valid0 = _errs2 === errors;
errors = _errs1;
if(vErrors !== null){
if(_errs1){
vErrors.length = _errs1;
}
else {
vErrors = null;
}
}
let ifClause0;
if(_valid0){
const _errs4 = errors;
if(data && typeof data == "object" && !Array.isArray(data)){
if(data.pressure_Pa !== undefined){
let data1 = data.pressure_Pa;
const _errs5 = errors;
if(errors === _errs5){
if((typeof data1 == "number") && (isFinite(data1))){
if(data1 > 110000 || isNaN(data1)){
validate32.errors = [{instancePath:instancePath+"/pressure_Pa",schemaPath:"#/then/properties/pressure_Pa/maximum",keyword:"maximum",params:{comparison: "<=", limit: 110000},message:"must be <= 110000"}];
return false;
}
else {
if(data1 < 85000 || isNaN(data1)){
validate32.errors = [{instancePath:instancePath+"/pressure_Pa",schemaPath:"#/then/properties/pressure_Pa/minimum",keyword:"minimum",params:{comparison: ">=", limit: 85000},message:"must be >= 85000"}];
return false;
}
}
}
else {
validate32.errors = [{instancePath:instancePath+"/pressure_Pa",schemaPath:"#/then/properties/pressure_Pa/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
}
}
var _valid0 = _errs4 === errors;
valid0 = _valid0;
if(valid0){
var props0 = {};
props0.pressure_Pa = true;
props0.pressure_reference = true;
}
ifClause0 = "then";
}
else {
const _errs7 = errors;
if(data && typeof data == "object" && !Array.isArray(data)){
if(data.pressure_Pa !== undefined){
let data2 = data.pressure_Pa;
const _errs8 = errors;
if(errors === _errs8){
if((typeof data2 == "number") && (isFinite(data2))){
if(data2 > 110000 || isNaN(data2)){
validate32.errors = [{instancePath:instancePath+"/pressure_Pa",schemaPath:"#/else/properties/pressure_Pa/maximum",keyword:"maximum",params:{comparison: "<=", limit: 110000},message:"must be <= 110000"}];
return false;
}
else {
if(data2 < 30000 || isNaN(data2)){
validate32.errors = [{instancePath:instancePath+"/pressure_Pa",schemaPath:"#/else/properties/pressure_Pa/minimum",keyword:"minimum",params:{comparison: ">=", limit: 30000},message:"must be >= 30000"}];
return false;
}
}
}
else {
validate32.errors = [{instancePath:instancePath+"/pressure_Pa",schemaPath:"#/else/properties/pressure_Pa/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
}
}
var _valid0 = _errs7 === errors;
valid0 = _valid0;
if(valid0){
if(props0 !== true){
props0 = props0 || {};
props0.pressure_Pa = true;
}
}
ifClause0 = "else";
}
if(!valid0){
const err2 = {instancePath,schemaPath:"#/if",keyword:"if",params:{failingKeyword: ifClause0},message:"must match \""+ifClause0+"\" schema"};
if(vErrors === null){
vErrors = [err2];
}
else {
vErrors.push(err2);
}
errors++;
validate32.errors = vErrors;
return false;
}
if(errors === 0){
if(data && typeof data == "object" && !Array.isArray(data)){
let missing1;
if((((((((((((((((((((data.id === undefined) && (missing1 = "id")) || ((data.kind === undefined) && (missing1 = "kind"))) || ((data.created_at === undefined) && (missing1 = "created_at"))) || ((data.updated_at === undefined) && (missing1 = "updated_at"))) || ((data.rev === undefined) && (missing1 = "rev"))) || ((data.device === undefined) && (missing1 = "device"))) || ((data.deleted === undefined) && (missing1 = "deleted"))) || ((data.history === undefined) && (missing1 = "history"))) || ((data.day_id === undefined) && (missing1 = "day_id"))) || ((data.taken_at === undefined) && (missing1 = "taken_at"))) || ((data.temperature_C === undefined) && (missing1 = "temperature_C"))) || ((data.u_temperature_C === undefined) && (missing1 = "u_temperature_C"))) || ((data.pressure_Pa === undefined) && (missing1 = "pressure_Pa"))) || ((data.u_pressure_Pa === undefined) && (missing1 = "u_pressure_Pa"))) || ((data.pressure_reference === undefined) && (missing1 = "pressure_reference"))) || ((data.humidity === undefined) && (missing1 = "humidity"))) || ((data.wind_speed_m_s === undefined) && (missing1 = "wind_speed_m_s"))) || ((data.instrument === undefined) && (missing1 = "instrument"))) || ((data.notes === undefined) && (missing1 = "notes"))){
validate32.errors = [{instancePath,schemaPath:"#/required",keyword:"required",params:{missingProperty: missing1},message:"must have required property '"+missing1+"'"}];
return false;
}
else {
const _errs10 = errors;
for(const key0 in data){
if(!(func1.call(schema61.properties, key0))){
validate32.errors = [{instancePath,schemaPath:"#/additionalProperties",keyword:"additionalProperties",params:{additionalProperty: key0},message:"must NOT have additional properties"}];
return false;
break;
}
}
if(_errs10 === errors){
if(data.id !== undefined){
let data3 = data.id;
const _errs11 = errors;
const _errs12 = errors;
if(errors === _errs12){
if(typeof data3 === "string"){
if(!pattern5.test(data3)){
validate32.errors = [{instancePath:instancePath+"/id",schemaPath:"#/$defs/id/pattern",keyword:"pattern",params:{pattern: "^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"},message:"must match pattern \""+"^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"+"\""}];
return false;
}
}
else {
validate32.errors = [{instancePath:instancePath+"/id",schemaPath:"#/$defs/id/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid4 = _errs11 === errors;
}
else {
var valid4 = true;
}
if(valid4){
if(data.kind !== undefined){
const _errs14 = errors;
if("reading" !== data.kind){
validate32.errors = [{instancePath:instancePath+"/kind",schemaPath:"#/properties/kind/const",keyword:"const",params:{allowedValue: "reading"},message:"must be equal to constant"}];
return false;
}
var valid4 = _errs14 === errors;
}
else {
var valid4 = true;
}
if(valid4){
if(data.created_at !== undefined){
let data5 = data.created_at;
const _errs15 = errors;
const _errs16 = errors;
if(errors === _errs16){
if(typeof data5 === "string"){
if(!pattern9.test(data5)){
validate32.errors = [{instancePath:instancePath+"/created_at",schemaPath:"#/$defs/instant/pattern",keyword:"pattern",params:{pattern: "^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"},message:"must match pattern \""+"^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"+"\""}];
return false;
}
}
else {
validate32.errors = [{instancePath:instancePath+"/created_at",schemaPath:"#/$defs/instant/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid4 = _errs15 === errors;
}
else {
var valid4 = true;
}
if(valid4){
if(data.updated_at !== undefined){
let data6 = data.updated_at;
const _errs18 = errors;
const _errs19 = errors;
if(errors === _errs19){
if(typeof data6 === "string"){
if(!pattern9.test(data6)){
validate32.errors = [{instancePath:instancePath+"/updated_at",schemaPath:"#/$defs/instant/pattern",keyword:"pattern",params:{pattern: "^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"},message:"must match pattern \""+"^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"+"\""}];
return false;
}
}
else {
validate32.errors = [{instancePath:instancePath+"/updated_at",schemaPath:"#/$defs/instant/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid4 = _errs18 === errors;
}
else {
var valid4 = true;
}
if(valid4){
if(data.rev !== undefined){
let data7 = data.rev;
const _errs21 = errors;
const _errs22 = errors;
if(errors === _errs22){
if(typeof data7 === "string"){
if(!pattern11.test(data7)){
validate32.errors = [{instancePath:instancePath+"/rev",schemaPath:"#/$defs/rev/pattern",keyword:"pattern",params:{pattern: "^\\d{15}-\\d{6}-[A-Za-z0-9_.:]+$"},message:"must match pattern \""+"^\\d{15}-\\d{6}-[A-Za-z0-9_.:]+$"+"\""}];
return false;
}
}
else {
validate32.errors = [{instancePath:instancePath+"/rev",schemaPath:"#/$defs/rev/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid4 = _errs21 === errors;
}
else {
var valid4 = true;
}
if(valid4){
if(data.device !== undefined){
let data8 = data.device;
const _errs24 = errors;
const _errs25 = errors;
if(errors === _errs25){
if(typeof data8 === "string"){
if(!pattern4.test(data8)){
validate32.errors = [{instancePath:instancePath+"/device",schemaPath:"#/$defs/device/pattern",keyword:"pattern",params:{pattern: "^[A-Za-z0-9_.:]+$"},message:"must match pattern \""+"^[A-Za-z0-9_.:]+$"+"\""}];
return false;
}
}
else {
validate32.errors = [{instancePath:instancePath+"/device",schemaPath:"#/$defs/device/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid4 = _errs24 === errors;
}
else {
var valid4 = true;
}
if(valid4){
if(data.deleted !== undefined){
const _errs27 = errors;
if(typeof data.deleted !== "boolean"){
validate32.errors = [{instancePath:instancePath+"/deleted",schemaPath:"#/properties/deleted/type",keyword:"type",params:{type: "boolean"},message:"must be boolean"}];
return false;
}
var valid4 = _errs27 === errors;
}
else {
var valid4 = true;
}
if(valid4){
if(data.history !== undefined){
let data10 = data.history;
const _errs29 = errors;
if(errors === _errs29){
if(Array.isArray(data10)){
var valid10 = true;
const len0 = data10.length;
for(let i0=0; i0<len0; i0++){
const _errs31 = errors;
if(!(validate23(data10[i0], {instancePath:instancePath+"/history/" + i0,parentData:data10,parentDataProperty:i0,rootData,dynamicAnchors}))){
vErrors = vErrors === null ? validate23.errors : vErrors.concat(validate23.errors);
errors = vErrors.length;
}
var valid10 = _errs31 === errors;
if(!valid10){
break;
}
}
}
else {
validate32.errors = [{instancePath:instancePath+"/history",schemaPath:"#/properties/history/type",keyword:"type",params:{type: "array"},message:"must be array"}];
return false;
}
}
var valid4 = _errs29 === errors;
}
else {
var valid4 = true;
}
if(valid4){
if(data.day_id !== undefined){
let data12 = data.day_id;
const _errs32 = errors;
const _errs33 = errors;
if(errors === _errs33){
if(typeof data12 === "string"){
if(!pattern5.test(data12)){
validate32.errors = [{instancePath:instancePath+"/day_id",schemaPath:"#/$defs/id/pattern",keyword:"pattern",params:{pattern: "^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"},message:"must match pattern \""+"^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"+"\""}];
return false;
}
}
else {
validate32.errors = [{instancePath:instancePath+"/day_id",schemaPath:"#/$defs/id/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid4 = _errs32 === errors;
}
else {
var valid4 = true;
}
if(valid4){
if(data.taken_at !== undefined){
let data13 = data.taken_at;
const _errs35 = errors;
const _errs36 = errors;
if(errors === _errs36){
if(typeof data13 === "string"){
if(!pattern9.test(data13)){
validate32.errors = [{instancePath:instancePath+"/taken_at",schemaPath:"#/$defs/instant/pattern",keyword:"pattern",params:{pattern: "^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"},message:"must match pattern \""+"^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"+"\""}];
return false;
}
}
else {
validate32.errors = [{instancePath:instancePath+"/taken_at",schemaPath:"#/$defs/instant/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid4 = _errs35 === errors;
}
else {
var valid4 = true;
}
if(valid4){
if(data.temperature_C !== undefined){
let data14 = data.temperature_C;
const _errs38 = errors;
if(errors === _errs38){
if((typeof data14 == "number") && (isFinite(data14))){
if(data14 > 60 || isNaN(data14)){
validate32.errors = [{instancePath:instancePath+"/temperature_C",schemaPath:"#/properties/temperature_C/maximum",keyword:"maximum",params:{comparison: "<=", limit: 60},message:"must be <= 60"}];
return false;
}
else {
if(data14 < -90 || isNaN(data14)){
validate32.errors = [{instancePath:instancePath+"/temperature_C",schemaPath:"#/properties/temperature_C/minimum",keyword:"minimum",params:{comparison: ">=", limit: -90},message:"must be >= -90"}];
return false;
}
}
}
else {
validate32.errors = [{instancePath:instancePath+"/temperature_C",schemaPath:"#/properties/temperature_C/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid4 = _errs38 === errors;
}
else {
var valid4 = true;
}
if(valid4){
if(data.u_temperature_C !== undefined){
let data15 = data.u_temperature_C;
const _errs40 = errors;
if(errors === _errs40){
if((typeof data15 == "number") && (isFinite(data15))){
if(data15 > 10 || isNaN(data15)){
validate32.errors = [{instancePath:instancePath+"/u_temperature_C",schemaPath:"#/properties/u_temperature_C/maximum",keyword:"maximum",params:{comparison: "<=", limit: 10},message:"must be <= 10"}];
return false;
}
else {
if(data15 < 0 || isNaN(data15)){
validate32.errors = [{instancePath:instancePath+"/u_temperature_C",schemaPath:"#/properties/u_temperature_C/minimum",keyword:"minimum",params:{comparison: ">=", limit: 0},message:"must be >= 0"}];
return false;
}
}
}
else {
validate32.errors = [{instancePath:instancePath+"/u_temperature_C",schemaPath:"#/properties/u_temperature_C/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid4 = _errs40 === errors;
}
else {
var valid4 = true;
}
if(valid4){
if(data.pressure_Pa !== undefined){
let data16 = data.pressure_Pa;
const _errs42 = errors;
if(!((typeof data16 == "number") && (isFinite(data16)))){
validate32.errors = [{instancePath:instancePath+"/pressure_Pa",schemaPath:"#/properties/pressure_Pa/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
var valid4 = _errs42 === errors;
}
else {
var valid4 = true;
}
if(valid4){
if(data.u_pressure_Pa !== undefined){
let data17 = data.u_pressure_Pa;
const _errs44 = errors;
if(errors === _errs44){
if((typeof data17 == "number") && (isFinite(data17))){
if(data17 > 5000 || isNaN(data17)){
validate32.errors = [{instancePath:instancePath+"/u_pressure_Pa",schemaPath:"#/properties/u_pressure_Pa/maximum",keyword:"maximum",params:{comparison: "<=", limit: 5000},message:"must be <= 5000"}];
return false;
}
else {
if(data17 < 0 || isNaN(data17)){
validate32.errors = [{instancePath:instancePath+"/u_pressure_Pa",schemaPath:"#/properties/u_pressure_Pa/minimum",keyword:"minimum",params:{comparison: ">=", limit: 0},message:"must be >= 0"}];
return false;
}
}
}
else {
validate32.errors = [{instancePath:instancePath+"/u_pressure_Pa",schemaPath:"#/properties/u_pressure_Pa/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid4 = _errs44 === errors;
}
else {
var valid4 = true;
}
if(valid4){
if(data.pressure_reference !== undefined){
let data18 = data.pressure_reference;
const _errs46 = errors;
if(typeof data18 !== "string"){
validate32.errors = [{instancePath:instancePath+"/pressure_reference",schemaPath:"#/properties/pressure_reference/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
if(!((data18 === "station") || (data18 === "sea_level"))){
validate32.errors = [{instancePath:instancePath+"/pressure_reference",schemaPath:"#/properties/pressure_reference/enum",keyword:"enum",params:{allowedValues: schema61.properties.pressure_reference.enum},message:"must be equal to one of the allowed values"}];
return false;
}
var valid4 = _errs46 === errors;
}
else {
var valid4 = true;
}
if(valid4){
if(data.humidity !== undefined){
let data19 = data.humidity;
const _errs48 = errors;
const _errs50 = errors;
const _errs51 = errors;
let valid14 = true;
const _errs52 = errors;
if(data19 && typeof data19 == "object" && !Array.isArray(data19)){
let missing2;
if((data19.kind === undefined) && (missing2 = "kind")){
const err3 = {};
if(vErrors === null){
vErrors = [err3];
}
else {
vErrors.push(err3);
}
errors++;
}
else {
if(data19.kind !== undefined){
if("relative" !== data19.kind){
const err4 = {};
if(vErrors === null){
vErrors = [err4];
}
else {
vErrors.push(err4);
}
errors++;
}
}
}
}
var _valid1 = _errs52 === errors;
errors = _errs51;
if(vErrors !== null){
if(_errs51){
vErrors.length = _errs51;
}
else {
vErrors = null;
}
}
if(_valid1){
const _errs54 = errors;
if(errors === _errs54){
if(data19 && typeof data19 == "object" && !Array.isArray(data19)){
let missing3;
if((((data19.kind === undefined) && (missing3 = "kind")) || ((data19.relative_humidity_pct === undefined) && (missing3 = "relative_humidity_pct"))) || ((data19.u_relative_humidity_pct === undefined) && (missing3 = "u_relative_humidity_pct"))){
validate32.errors = [{instancePath:instancePath+"/humidity",schemaPath:"#/properties/humidity/allOf/0/then/required",keyword:"required",params:{missingProperty: missing3},message:"must have required property '"+missing3+"'"}];
return false;
}
else {
const _errs56 = errors;
for(const key1 in data19){
if(!(((key1 === "kind") || (key1 === "relative_humidity_pct")) || (key1 === "u_relative_humidity_pct"))){
validate32.errors = [{instancePath:instancePath+"/humidity",schemaPath:"#/properties/humidity/allOf/0/then/additionalProperties",keyword:"additionalProperties",params:{additionalProperty: key1},message:"must NOT have additional properties"}];
return false;
break;
}
}
if(_errs56 === errors){
if(data19.kind !== undefined){
const _errs57 = errors;
if("relative" !== data19.kind){
validate32.errors = [{instancePath:instancePath+"/humidity/kind",schemaPath:"#/properties/humidity/allOf/0/then/properties/kind/const",keyword:"const",params:{allowedValue: "relative"},message:"must be equal to constant"}];
return false;
}
var valid16 = _errs57 === errors;
}
else {
var valid16 = true;
}
if(valid16){
if(data19.relative_humidity_pct !== undefined){
let data22 = data19.relative_humidity_pct;
const _errs58 = errors;
if(errors === _errs58){
if((typeof data22 == "number") && (isFinite(data22))){
if(data22 > 100 || isNaN(data22)){
validate32.errors = [{instancePath:instancePath+"/humidity/relative_humidity_pct",schemaPath:"#/properties/humidity/allOf/0/then/properties/relative_humidity_pct/maximum",keyword:"maximum",params:{comparison: "<=", limit: 100},message:"must be <= 100"}];
return false;
}
else {
if(data22 < 0 || isNaN(data22)){
validate32.errors = [{instancePath:instancePath+"/humidity/relative_humidity_pct",schemaPath:"#/properties/humidity/allOf/0/then/properties/relative_humidity_pct/minimum",keyword:"minimum",params:{comparison: ">=", limit: 0},message:"must be >= 0"}];
return false;
}
}
}
else {
validate32.errors = [{instancePath:instancePath+"/humidity/relative_humidity_pct",schemaPath:"#/properties/humidity/allOf/0/then/properties/relative_humidity_pct/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid16 = _errs58 === errors;
}
else {
var valid16 = true;
}
if(valid16){
if(data19.u_relative_humidity_pct !== undefined){
let data23 = data19.u_relative_humidity_pct;
const _errs60 = errors;
if(errors === _errs60){
if((typeof data23 == "number") && (isFinite(data23))){
if(data23 > 100 || isNaN(data23)){
validate32.errors = [{instancePath:instancePath+"/humidity/u_relative_humidity_pct",schemaPath:"#/properties/humidity/allOf/0/then/properties/u_relative_humidity_pct/maximum",keyword:"maximum",params:{comparison: "<=", limit: 100},message:"must be <= 100"}];
return false;
}
else {
if(data23 < 0 || isNaN(data23)){
validate32.errors = [{instancePath:instancePath+"/humidity/u_relative_humidity_pct",schemaPath:"#/properties/humidity/allOf/0/then/properties/u_relative_humidity_pct/minimum",keyword:"minimum",params:{comparison: ">=", limit: 0},message:"must be >= 0"}];
return false;
}
}
}
else {
validate32.errors = [{instancePath:instancePath+"/humidity/u_relative_humidity_pct",schemaPath:"#/properties/humidity/allOf/0/then/properties/u_relative_humidity_pct/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid16 = _errs60 === errors;
}
else {
var valid16 = true;
}
}
}
}
}
}
else {
validate32.errors = [{instancePath:instancePath+"/humidity",schemaPath:"#/properties/humidity/allOf/0/then/type",keyword:"type",params:{type: "object"},message:"must be object"}];
return false;
}
}
var _valid1 = _errs54 === errors;
valid14 = _valid1;
if(valid14){
var props1 = true;
}
}
if(!valid14){
const err5 = {instancePath:instancePath+"/humidity",schemaPath:"#/properties/humidity/allOf/0/if",keyword:"if",params:{failingKeyword: "then"},message:"must match \"then\" schema"};
if(vErrors === null){
vErrors = [err5];
}
else {
vErrors.push(err5);
}
errors++;
validate32.errors = vErrors;
return false;
}
var valid13 = _errs50 === errors;
if(valid13){
const _errs62 = errors;
const _errs63 = errors;
let valid17 = true;
const _errs64 = errors;
if(data19 && typeof data19 == "object" && !Array.isArray(data19)){
let missing4;
if((data19.kind === undefined) && (missing4 = "kind")){
const err6 = {};
if(vErrors === null){
vErrors = [err6];
}
else {
vErrors.push(err6);
}
errors++;
}
else {
if(data19.kind !== undefined){
if("dew_point" !== data19.kind){
const err7 = {};
if(vErrors === null){
vErrors = [err7];
}
else {
vErrors.push(err7);
}
errors++;
}
}
}
}
var _valid2 = _errs64 === errors;
errors = _errs63;
if(vErrors !== null){
if(_errs63){
vErrors.length = _errs63;
}
else {
vErrors = null;
}
}
if(_valid2){
const _errs66 = errors;
if(errors === _errs66){
if(data19 && typeof data19 == "object" && !Array.isArray(data19)){
let missing5;
if((((data19.kind === undefined) && (missing5 = "kind")) || ((data19.dew_point_C === undefined) && (missing5 = "dew_point_C"))) || ((data19.u_dew_point_C === undefined) && (missing5 = "u_dew_point_C"))){
validate32.errors = [{instancePath:instancePath+"/humidity",schemaPath:"#/properties/humidity/allOf/1/then/required",keyword:"required",params:{missingProperty: missing5},message:"must have required property '"+missing5+"'"}];
return false;
}
else {
const _errs68 = errors;
for(const key2 in data19){
if(!(((key2 === "kind") || (key2 === "dew_point_C")) || (key2 === "u_dew_point_C"))){
validate32.errors = [{instancePath:instancePath+"/humidity",schemaPath:"#/properties/humidity/allOf/1/then/additionalProperties",keyword:"additionalProperties",params:{additionalProperty: key2},message:"must NOT have additional properties"}];
return false;
break;
}
}
if(_errs68 === errors){
if(data19.kind !== undefined){
const _errs69 = errors;
if("dew_point" !== data19.kind){
validate32.errors = [{instancePath:instancePath+"/humidity/kind",schemaPath:"#/properties/humidity/allOf/1/then/properties/kind/const",keyword:"const",params:{allowedValue: "dew_point"},message:"must be equal to constant"}];
return false;
}
var valid19 = _errs69 === errors;
}
else {
var valid19 = true;
}
if(valid19){
if(data19.dew_point_C !== undefined){
let data26 = data19.dew_point_C;
const _errs70 = errors;
if(errors === _errs70){
if((typeof data26 == "number") && (isFinite(data26))){
if(data26 > 60 || isNaN(data26)){
validate32.errors = [{instancePath:instancePath+"/humidity/dew_point_C",schemaPath:"#/properties/humidity/allOf/1/then/properties/dew_point_C/maximum",keyword:"maximum",params:{comparison: "<=", limit: 60},message:"must be <= 60"}];
return false;
}
else {
if(data26 < -90 || isNaN(data26)){
validate32.errors = [{instancePath:instancePath+"/humidity/dew_point_C",schemaPath:"#/properties/humidity/allOf/1/then/properties/dew_point_C/minimum",keyword:"minimum",params:{comparison: ">=", limit: -90},message:"must be >= -90"}];
return false;
}
}
}
else {
validate32.errors = [{instancePath:instancePath+"/humidity/dew_point_C",schemaPath:"#/properties/humidity/allOf/1/then/properties/dew_point_C/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid19 = _errs70 === errors;
}
else {
var valid19 = true;
}
if(valid19){
if(data19.u_dew_point_C !== undefined){
let data27 = data19.u_dew_point_C;
const _errs72 = errors;
if(errors === _errs72){
if((typeof data27 == "number") && (isFinite(data27))){
if(data27 > 10 || isNaN(data27)){
validate32.errors = [{instancePath:instancePath+"/humidity/u_dew_point_C",schemaPath:"#/properties/humidity/allOf/1/then/properties/u_dew_point_C/maximum",keyword:"maximum",params:{comparison: "<=", limit: 10},message:"must be <= 10"}];
return false;
}
else {
if(data27 < 0 || isNaN(data27)){
validate32.errors = [{instancePath:instancePath+"/humidity/u_dew_point_C",schemaPath:"#/properties/humidity/allOf/1/then/properties/u_dew_point_C/minimum",keyword:"minimum",params:{comparison: ">=", limit: 0},message:"must be >= 0"}];
return false;
}
}
}
else {
validate32.errors = [{instancePath:instancePath+"/humidity/u_dew_point_C",schemaPath:"#/properties/humidity/allOf/1/then/properties/u_dew_point_C/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid19 = _errs72 === errors;
}
else {
var valid19 = true;
}
}
}
}
}
}
else {
validate32.errors = [{instancePath:instancePath+"/humidity",schemaPath:"#/properties/humidity/allOf/1/then/type",keyword:"type",params:{type: "object"},message:"must be object"}];
return false;
}
}
var _valid2 = _errs66 === errors;
valid17 = _valid2;
if(valid17){
var props2 = true;
}
}
if(!valid17){
const err8 = {instancePath:instancePath+"/humidity",schemaPath:"#/properties/humidity/allOf/1/if",keyword:"if",params:{failingKeyword: "then"},message:"must match \"then\" schema"};
if(vErrors === null){
vErrors = [err8];
}
else {
vErrors.push(err8);
}
errors++;
validate32.errors = vErrors;
return false;
}
var valid13 = _errs62 === errors;
if(valid13){
if(props1 !== true && props2 !== undefined){
if(props2 === true){
props1 = true;
}
else {
props1 = props1 || {};
Object.assign(props1, props2);
}
}
}
}
if(errors === _errs48){
if(data19 && typeof data19 == "object" && !Array.isArray(data19)){
let missing6;
if((data19.kind === undefined) && (missing6 = "kind")){
validate32.errors = [{instancePath:instancePath+"/humidity",schemaPath:"#/properties/humidity/required",keyword:"required",params:{missingProperty: missing6},message:"must have required property '"+missing6+"'"}];
return false;
}
else {
if(props1 !== true){
props1 = props1 || {};
props1.kind = true;
}
if(data19.kind !== undefined){
let data28 = data19.kind;
if(typeof data28 !== "string"){
validate32.errors = [{instancePath:instancePath+"/humidity/kind",schemaPath:"#/properties/humidity/properties/kind/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
if(!((data28 === "relative") || (data28 === "dew_point"))){
validate32.errors = [{instancePath:instancePath+"/humidity/kind",schemaPath:"#/properties/humidity/properties/kind/enum",keyword:"enum",params:{allowedValues: schema61.properties.humidity.properties.kind.enum},message:"must be equal to one of the allowed values"}];
return false;
}
}
}
}
else {
validate32.errors = [{instancePath:instancePath+"/humidity",schemaPath:"#/properties/humidity/type",keyword:"type",params:{type: "object"},message:"must be object"}];
return false;
}
}
var valid4 = _errs48 === errors;
}
else {
var valid4 = true;
}
if(valid4){
if(data.wind_speed_m_s !== undefined){
let data29 = data.wind_speed_m_s;
const _errs76 = errors;
const _errs77 = errors;
let valid21 = false;
const _errs78 = errors;
if(errors === _errs78){
if((typeof data29 == "number") && (isFinite(data29))){
if(data29 > 75 || isNaN(data29)){
const err9 = {instancePath:instancePath+"/wind_speed_m_s",schemaPath:"#/properties/wind_speed_m_s/anyOf/0/maximum",keyword:"maximum",params:{comparison: "<=", limit: 75},message:"must be <= 75"};
if(vErrors === null){
vErrors = [err9];
}
else {
vErrors.push(err9);
}
errors++;
}
else {
if(data29 < 0 || isNaN(data29)){
const err10 = {instancePath:instancePath+"/wind_speed_m_s",schemaPath:"#/properties/wind_speed_m_s/anyOf/0/minimum",keyword:"minimum",params:{comparison: ">=", limit: 0},message:"must be >= 0"};
if(vErrors === null){
vErrors = [err10];
}
else {
vErrors.push(err10);
}
errors++;
}
}
}
else {
const err11 = {instancePath:instancePath+"/wind_speed_m_s",schemaPath:"#/properties/wind_speed_m_s/anyOf/0/type",keyword:"type",params:{type: "number"},message:"must be number"};
if(vErrors === null){
vErrors = [err11];
}
else {
vErrors.push(err11);
}
errors++;
}
}
var _valid3 = _errs78 === errors;
valid21 = valid21 || _valid3;
const _errs80 = errors;
if(data29 !== null){
const err12 = {instancePath:instancePath+"/wind_speed_m_s",schemaPath:"#/properties/wind_speed_m_s/anyOf/1/type",keyword:"type",params:{type: "null"},message:"must be null"};
if(vErrors === null){
vErrors = [err12];
}
else {
vErrors.push(err12);
}
errors++;
}
var _valid3 = _errs80 === errors;
valid21 = valid21 || _valid3;
if(!valid21){
const err13 = {instancePath:instancePath+"/wind_speed_m_s",schemaPath:"#/properties/wind_speed_m_s/anyOf",keyword:"anyOf",params:{},message:"must match a schema in anyOf"};
if(vErrors === null){
vErrors = [err13];
}
else {
vErrors.push(err13);
}
errors++;
validate32.errors = vErrors;
return false;
}
else {
errors = _errs77;
if(vErrors !== null){
if(_errs77){
vErrors.length = _errs77;
}
else {
vErrors = null;
}
}
}
var valid4 = _errs76 === errors;
}
else {
var valid4 = true;
}
if(valid4){
if(data.instrument !== undefined){
const _errs82 = errors;
if(typeof data.instrument !== "string"){
validate32.errors = [{instancePath:instancePath+"/instrument",schemaPath:"#/properties/instrument/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
var valid4 = _errs82 === errors;
}
else {
var valid4 = true;
}
if(valid4){
if(data.notes !== undefined){
const _errs84 = errors;
if(typeof data.notes !== "string"){
validate32.errors = [{instancePath:instancePath+"/notes",schemaPath:"#/properties/notes/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
var valid4 = _errs84 === errors;
}
else {
var valid4 = true;
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
else {
validate32.errors = [{instancePath,schemaPath:"#/type",keyword:"type",params:{type: "object"},message:"must be object"}];
return false;
}
}
validate32.errors = vErrors;
return errors === 0;
}
validate32.evaluated = {"props":true,"dynamicProps":false,"dynamicItems":false};

const schema69 = {"type":"object","required":["id","kind","created_at","updated_at","rev","device","deleted","history","day_id","specimen_id","height_m","u_height_m","height_method","timing_method","u_time_s","target_relative_uncertainty","reading_id","timing_offset","started_at","notes"],"properties":{"id":{"$ref":"#/$defs/id"},"kind":{"const":"series"},"created_at":{"$ref":"#/$defs/instant"},"updated_at":{"$ref":"#/$defs/instant"},"rev":{"$ref":"#/$defs/rev"},"device":{"$ref":"#/$defs/device"},"deleted":{"type":"boolean","description":"A deleted record stays as a tombstone so the deletion travels."},"history":{"type":"array","items":{"$ref":"#/$defs/revision"},"description":"Earlier versions, oldest first."},"day_id":{"$ref":"#/$defs/id"},"specimen_id":{"$ref":"#/$defs/id"},"height_m":{"type":"number","exclusiveMinimum":0,"maximum":1000,"description":"Release height above the landing surface."},"u_height_m":{"type":"number","minimum":0},"height_method":{"type":"string","enum":["tape","laser","survey","marked","other"]},"timing_method":{"type":"string","enum":["typed","stopwatch","tap","sound","video","gates"]},"u_time_s":{"type":"number","minimum":0,"maximum":10,"description":"Standard uncertainty of one drop time from random causes."},"target_relative_uncertainty":{"type":"number","exclusiveMinimum":0,"maximum":1},"reading_id":{"anyOf":[{"$ref":"#/$defs/id"},{"type":"null"}]},"timing_offset":{"type":"string","enum":["none","fit"]},"started_at":{"$ref":"#/$defs/instant"},"notes":{"type":"string"}},"additionalProperties":false};

function validate35(data, {instancePath="", parentData, parentDataProperty, rootData=data, dynamicAnchors={}}={}){
let vErrors = null;
let errors = 0;
const evaluated0 = validate35.evaluated;
if(evaluated0.dynamicProps){
evaluated0.props = undefined;
}
if(evaluated0.dynamicItems){
evaluated0.items = undefined;
}
if(errors === 0){
if(data && typeof data == "object" && !Array.isArray(data)){
let missing0;
if(((((((((((((((((((((data.id === undefined) && (missing0 = "id")) || ((data.kind === undefined) && (missing0 = "kind"))) || ((data.created_at === undefined) && (missing0 = "created_at"))) || ((data.updated_at === undefined) && (missing0 = "updated_at"))) || ((data.rev === undefined) && (missing0 = "rev"))) || ((data.device === undefined) && (missing0 = "device"))) || ((data.deleted === undefined) && (missing0 = "deleted"))) || ((data.history === undefined) && (missing0 = "history"))) || ((data.day_id === undefined) && (missing0 = "day_id"))) || ((data.specimen_id === undefined) && (missing0 = "specimen_id"))) || ((data.height_m === undefined) && (missing0 = "height_m"))) || ((data.u_height_m === undefined) && (missing0 = "u_height_m"))) || ((data.height_method === undefined) && (missing0 = "height_method"))) || ((data.timing_method === undefined) && (missing0 = "timing_method"))) || ((data.u_time_s === undefined) && (missing0 = "u_time_s"))) || ((data.target_relative_uncertainty === undefined) && (missing0 = "target_relative_uncertainty"))) || ((data.reading_id === undefined) && (missing0 = "reading_id"))) || ((data.timing_offset === undefined) && (missing0 = "timing_offset"))) || ((data.started_at === undefined) && (missing0 = "started_at"))) || ((data.notes === undefined) && (missing0 = "notes"))){
validate35.errors = [{instancePath,schemaPath:"#/required",keyword:"required",params:{missingProperty: missing0},message:"must have required property '"+missing0+"'"}];
return false;
}
else {
const _errs1 = errors;
for(const key0 in data){
if(!(func1.call(schema69.properties, key0))){
validate35.errors = [{instancePath,schemaPath:"#/additionalProperties",keyword:"additionalProperties",params:{additionalProperty: key0},message:"must NOT have additional properties"}];
return false;
break;
}
}
if(_errs1 === errors){
if(data.id !== undefined){
let data0 = data.id;
const _errs2 = errors;
const _errs3 = errors;
if(errors === _errs3){
if(typeof data0 === "string"){
if(!pattern5.test(data0)){
validate35.errors = [{instancePath:instancePath+"/id",schemaPath:"#/$defs/id/pattern",keyword:"pattern",params:{pattern: "^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"},message:"must match pattern \""+"^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"+"\""}];
return false;
}
}
else {
validate35.errors = [{instancePath:instancePath+"/id",schemaPath:"#/$defs/id/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs2 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.kind !== undefined){
const _errs5 = errors;
if("series" !== data.kind){
validate35.errors = [{instancePath:instancePath+"/kind",schemaPath:"#/properties/kind/const",keyword:"const",params:{allowedValue: "series"},message:"must be equal to constant"}];
return false;
}
var valid0 = _errs5 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.created_at !== undefined){
let data2 = data.created_at;
const _errs6 = errors;
const _errs7 = errors;
if(errors === _errs7){
if(typeof data2 === "string"){
if(!pattern9.test(data2)){
validate35.errors = [{instancePath:instancePath+"/created_at",schemaPath:"#/$defs/instant/pattern",keyword:"pattern",params:{pattern: "^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"},message:"must match pattern \""+"^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"+"\""}];
return false;
}
}
else {
validate35.errors = [{instancePath:instancePath+"/created_at",schemaPath:"#/$defs/instant/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs6 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.updated_at !== undefined){
let data3 = data.updated_at;
const _errs9 = errors;
const _errs10 = errors;
if(errors === _errs10){
if(typeof data3 === "string"){
if(!pattern9.test(data3)){
validate35.errors = [{instancePath:instancePath+"/updated_at",schemaPath:"#/$defs/instant/pattern",keyword:"pattern",params:{pattern: "^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"},message:"must match pattern \""+"^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"+"\""}];
return false;
}
}
else {
validate35.errors = [{instancePath:instancePath+"/updated_at",schemaPath:"#/$defs/instant/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs9 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.rev !== undefined){
let data4 = data.rev;
const _errs12 = errors;
const _errs13 = errors;
if(errors === _errs13){
if(typeof data4 === "string"){
if(!pattern11.test(data4)){
validate35.errors = [{instancePath:instancePath+"/rev",schemaPath:"#/$defs/rev/pattern",keyword:"pattern",params:{pattern: "^\\d{15}-\\d{6}-[A-Za-z0-9_.:]+$"},message:"must match pattern \""+"^\\d{15}-\\d{6}-[A-Za-z0-9_.:]+$"+"\""}];
return false;
}
}
else {
validate35.errors = [{instancePath:instancePath+"/rev",schemaPath:"#/$defs/rev/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs12 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.device !== undefined){
let data5 = data.device;
const _errs15 = errors;
const _errs16 = errors;
if(errors === _errs16){
if(typeof data5 === "string"){
if(!pattern4.test(data5)){
validate35.errors = [{instancePath:instancePath+"/device",schemaPath:"#/$defs/device/pattern",keyword:"pattern",params:{pattern: "^[A-Za-z0-9_.:]+$"},message:"must match pattern \""+"^[A-Za-z0-9_.:]+$"+"\""}];
return false;
}
}
else {
validate35.errors = [{instancePath:instancePath+"/device",schemaPath:"#/$defs/device/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs15 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.deleted !== undefined){
const _errs18 = errors;
if(typeof data.deleted !== "boolean"){
validate35.errors = [{instancePath:instancePath+"/deleted",schemaPath:"#/properties/deleted/type",keyword:"type",params:{type: "boolean"},message:"must be boolean"}];
return false;
}
var valid0 = _errs18 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.history !== undefined){
let data7 = data.history;
const _errs20 = errors;
if(errors === _errs20){
if(Array.isArray(data7)){
var valid6 = true;
const len0 = data7.length;
for(let i0=0; i0<len0; i0++){
const _errs22 = errors;
if(!(validate23(data7[i0], {instancePath:instancePath+"/history/" + i0,parentData:data7,parentDataProperty:i0,rootData,dynamicAnchors}))){
vErrors = vErrors === null ? validate23.errors : vErrors.concat(validate23.errors);
errors = vErrors.length;
}
var valid6 = _errs22 === errors;
if(!valid6){
break;
}
}
}
else {
validate35.errors = [{instancePath:instancePath+"/history",schemaPath:"#/properties/history/type",keyword:"type",params:{type: "array"},message:"must be array"}];
return false;
}
}
var valid0 = _errs20 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.day_id !== undefined){
let data9 = data.day_id;
const _errs23 = errors;
const _errs24 = errors;
if(errors === _errs24){
if(typeof data9 === "string"){
if(!pattern5.test(data9)){
validate35.errors = [{instancePath:instancePath+"/day_id",schemaPath:"#/$defs/id/pattern",keyword:"pattern",params:{pattern: "^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"},message:"must match pattern \""+"^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"+"\""}];
return false;
}
}
else {
validate35.errors = [{instancePath:instancePath+"/day_id",schemaPath:"#/$defs/id/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs23 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.specimen_id !== undefined){
let data10 = data.specimen_id;
const _errs26 = errors;
const _errs27 = errors;
if(errors === _errs27){
if(typeof data10 === "string"){
if(!pattern5.test(data10)){
validate35.errors = [{instancePath:instancePath+"/specimen_id",schemaPath:"#/$defs/id/pattern",keyword:"pattern",params:{pattern: "^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"},message:"must match pattern \""+"^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"+"\""}];
return false;
}
}
else {
validate35.errors = [{instancePath:instancePath+"/specimen_id",schemaPath:"#/$defs/id/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs26 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.height_m !== undefined){
let data11 = data.height_m;
const _errs29 = errors;
if(errors === _errs29){
if((typeof data11 == "number") && (isFinite(data11))){
if(data11 > 1000 || isNaN(data11)){
validate35.errors = [{instancePath:instancePath+"/height_m",schemaPath:"#/properties/height_m/maximum",keyword:"maximum",params:{comparison: "<=", limit: 1000},message:"must be <= 1000"}];
return false;
}
else {
if(data11 <= 0 || isNaN(data11)){
validate35.errors = [{instancePath:instancePath+"/height_m",schemaPath:"#/properties/height_m/exclusiveMinimum",keyword:"exclusiveMinimum",params:{comparison: ">", limit: 0},message:"must be > 0"}];
return false;
}
}
}
else {
validate35.errors = [{instancePath:instancePath+"/height_m",schemaPath:"#/properties/height_m/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid0 = _errs29 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.u_height_m !== undefined){
let data12 = data.u_height_m;
const _errs31 = errors;
if(errors === _errs31){
if((typeof data12 == "number") && (isFinite(data12))){
if(data12 < 0 || isNaN(data12)){
validate35.errors = [{instancePath:instancePath+"/u_height_m",schemaPath:"#/properties/u_height_m/minimum",keyword:"minimum",params:{comparison: ">=", limit: 0},message:"must be >= 0"}];
return false;
}
}
else {
validate35.errors = [{instancePath:instancePath+"/u_height_m",schemaPath:"#/properties/u_height_m/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid0 = _errs31 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.height_method !== undefined){
let data13 = data.height_method;
const _errs33 = errors;
if(typeof data13 !== "string"){
validate35.errors = [{instancePath:instancePath+"/height_method",schemaPath:"#/properties/height_method/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
if(!(((((data13 === "tape") || (data13 === "laser")) || (data13 === "survey")) || (data13 === "marked")) || (data13 === "other"))){
validate35.errors = [{instancePath:instancePath+"/height_method",schemaPath:"#/properties/height_method/enum",keyword:"enum",params:{allowedValues: schema69.properties.height_method.enum},message:"must be equal to one of the allowed values"}];
return false;
}
var valid0 = _errs33 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.timing_method !== undefined){
let data14 = data.timing_method;
const _errs35 = errors;
if(typeof data14 !== "string"){
validate35.errors = [{instancePath:instancePath+"/timing_method",schemaPath:"#/properties/timing_method/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
if(!((((((data14 === "typed") || (data14 === "stopwatch")) || (data14 === "tap")) || (data14 === "sound")) || (data14 === "video")) || (data14 === "gates"))){
validate35.errors = [{instancePath:instancePath+"/timing_method",schemaPath:"#/properties/timing_method/enum",keyword:"enum",params:{allowedValues: schema69.properties.timing_method.enum},message:"must be equal to one of the allowed values"}];
return false;
}
var valid0 = _errs35 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.u_time_s !== undefined){
let data15 = data.u_time_s;
const _errs37 = errors;
if(errors === _errs37){
if((typeof data15 == "number") && (isFinite(data15))){
if(data15 > 10 || isNaN(data15)){
validate35.errors = [{instancePath:instancePath+"/u_time_s",schemaPath:"#/properties/u_time_s/maximum",keyword:"maximum",params:{comparison: "<=", limit: 10},message:"must be <= 10"}];
return false;
}
else {
if(data15 < 0 || isNaN(data15)){
validate35.errors = [{instancePath:instancePath+"/u_time_s",schemaPath:"#/properties/u_time_s/minimum",keyword:"minimum",params:{comparison: ">=", limit: 0},message:"must be >= 0"}];
return false;
}
}
}
else {
validate35.errors = [{instancePath:instancePath+"/u_time_s",schemaPath:"#/properties/u_time_s/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid0 = _errs37 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.target_relative_uncertainty !== undefined){
let data16 = data.target_relative_uncertainty;
const _errs39 = errors;
if(errors === _errs39){
if((typeof data16 == "number") && (isFinite(data16))){
if(data16 > 1 || isNaN(data16)){
validate35.errors = [{instancePath:instancePath+"/target_relative_uncertainty",schemaPath:"#/properties/target_relative_uncertainty/maximum",keyword:"maximum",params:{comparison: "<=", limit: 1},message:"must be <= 1"}];
return false;
}
else {
if(data16 <= 0 || isNaN(data16)){
validate35.errors = [{instancePath:instancePath+"/target_relative_uncertainty",schemaPath:"#/properties/target_relative_uncertainty/exclusiveMinimum",keyword:"exclusiveMinimum",params:{comparison: ">", limit: 0},message:"must be > 0"}];
return false;
}
}
}
else {
validate35.errors = [{instancePath:instancePath+"/target_relative_uncertainty",schemaPath:"#/properties/target_relative_uncertainty/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid0 = _errs39 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.reading_id !== undefined){
let data17 = data.reading_id;
const _errs41 = errors;
const _errs42 = errors;
let valid9 = false;
const _errs43 = errors;
const _errs44 = errors;
if(errors === _errs44){
if(typeof data17 === "string"){
if(!pattern5.test(data17)){
const err0 = {instancePath:instancePath+"/reading_id",schemaPath:"#/$defs/id/pattern",keyword:"pattern",params:{pattern: "^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"},message:"must match pattern \""+"^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"+"\""};
if(vErrors === null){
vErrors = [err0];
}
else {
vErrors.push(err0);
}
errors++;
}
}
else {
const err1 = {instancePath:instancePath+"/reading_id",schemaPath:"#/$defs/id/type",keyword:"type",params:{type: "string"},message:"must be string"};
if(vErrors === null){
vErrors = [err1];
}
else {
vErrors.push(err1);
}
errors++;
}
}
var _valid0 = _errs43 === errors;
valid9 = valid9 || _valid0;
const _errs46 = errors;
if(data17 !== null){
const err2 = {instancePath:instancePath+"/reading_id",schemaPath:"#/properties/reading_id/anyOf/1/type",keyword:"type",params:{type: "null"},message:"must be null"};
if(vErrors === null){
vErrors = [err2];
}
else {
vErrors.push(err2);
}
errors++;
}
var _valid0 = _errs46 === errors;
valid9 = valid9 || _valid0;
if(!valid9){
const err3 = {instancePath:instancePath+"/reading_id",schemaPath:"#/properties/reading_id/anyOf",keyword:"anyOf",params:{},message:"must match a schema in anyOf"};
if(vErrors === null){
vErrors = [err3];
}
else {
vErrors.push(err3);
}
errors++;
validate35.errors = vErrors;
return false;
}
else {
errors = _errs42;
if(vErrors !== null){
if(_errs42){
vErrors.length = _errs42;
}
else {
vErrors = null;
}
}
}
var valid0 = _errs41 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.timing_offset !== undefined){
let data18 = data.timing_offset;
const _errs48 = errors;
if(typeof data18 !== "string"){
validate35.errors = [{instancePath:instancePath+"/timing_offset",schemaPath:"#/properties/timing_offset/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
if(!((data18 === "none") || (data18 === "fit"))){
validate35.errors = [{instancePath:instancePath+"/timing_offset",schemaPath:"#/properties/timing_offset/enum",keyword:"enum",params:{allowedValues: schema69.properties.timing_offset.enum},message:"must be equal to one of the allowed values"}];
return false;
}
var valid0 = _errs48 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.started_at !== undefined){
let data19 = data.started_at;
const _errs50 = errors;
const _errs51 = errors;
if(errors === _errs51){
if(typeof data19 === "string"){
if(!pattern9.test(data19)){
validate35.errors = [{instancePath:instancePath+"/started_at",schemaPath:"#/$defs/instant/pattern",keyword:"pattern",params:{pattern: "^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"},message:"must match pattern \""+"^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"+"\""}];
return false;
}
}
else {
validate35.errors = [{instancePath:instancePath+"/started_at",schemaPath:"#/$defs/instant/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs50 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.notes !== undefined){
const _errs53 = errors;
if(typeof data.notes !== "string"){
validate35.errors = [{instancePath:instancePath+"/notes",schemaPath:"#/properties/notes/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
var valid0 = _errs53 === errors;
}
else {
var valid0 = true;
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
else {
validate35.errors = [{instancePath,schemaPath:"#/type",keyword:"type",params:{type: "object"},message:"must be object"}];
return false;
}
}
validate35.errors = vErrors;
return errors === 0;
}
validate35.evaluated = {"props":true,"dynamicProps":false,"dynamicItems":false};

const schema79 = {"type":"object","required":["id","kind","created_at","updated_at","rev","device","deleted","history","series_id","seq","raw","time_s","height_m","excluded","exclusion_reason","note","captured_at"],"properties":{"id":{"$ref":"#/$defs/id"},"kind":{"const":"drop"},"created_at":{"$ref":"#/$defs/instant"},"updated_at":{"$ref":"#/$defs/instant"},"rev":{"$ref":"#/$defs/rev"},"device":{"$ref":"#/$defs/device"},"deleted":{"type":"boolean","description":"A deleted record stays as a tombstone so the deletion travels."},"history":{"type":"array","items":{"$ref":"#/$defs/revision"},"description":"Earlier versions, oldest first."},"series_id":{"$ref":"#/$defs/id"},"seq":{"type":"integer","minimum":1},"raw":{"type":"object","description":"The capture exactly as it came from the phone or the keyboard.","required":["kind"],"properties":{"kind":{"type":"string","enum":["typed","taps","sound","frames"]}},"allOf":[{"if":{"properties":{"kind":{"const":"typed"}},"required":["kind"]},"then":{"type":"object","required":["kind","text"],"properties":{"kind":{"const":"typed"},"text":{"type":"string"}},"additionalProperties":false}},{"if":{"properties":{"kind":{"const":"taps"}},"required":["kind"]},"then":{"type":"object","required":["kind","timestamps_ms"],"properties":{"kind":{"const":"taps"},"timestamps_ms":{"type":"array","minItems":2,"items":{"type":"number","minimum":0}}},"additionalProperties":false}},{"if":{"properties":{"kind":{"const":"sound"}},"required":["kind"]},"then":{"type":"object","required":["kind","onsets_s","sample_rate_Hz"],"properties":{"kind":{"const":"sound"},"onsets_s":{"type":"array","minItems":2,"items":{"type":"number","minimum":0}},"sample_rate_Hz":{"type":"number","exclusiveMinimum":0,"maximum":384000}},"additionalProperties":false}},{"if":{"properties":{"kind":{"const":"frames"}},"required":["kind"]},"then":{"type":"object","required":["kind","frames","frame_rate_Hz"],"properties":{"kind":{"const":"frames"},"frames":{"type":"array","minItems":2,"items":{"type":"integer","minimum":0}},"frame_rate_Hz":{"type":"number","exclusiveMinimum":0,"maximum":1000000}},"additionalProperties":false}}]},"time_s":{"type":"number","exclusiveMinimum":0,"maximum":3600},"height_m":{"anyOf":[{"type":"number","exclusiveMinimum":0,"maximum":1000},{"type":"null"}]},"excluded":{"type":"boolean"},"exclusion_reason":{"anyOf":[{"type":"string"},{"type":"null"}]},"note":{"type":"string"},"captured_at":{"$ref":"#/$defs/instant"}},"additionalProperties":false};

function validate38(data, {instancePath="", parentData, parentDataProperty, rootData=data, dynamicAnchors={}}={}){
let vErrors = null;
let errors = 0;
const evaluated0 = validate38.evaluated;
if(evaluated0.dynamicProps){
evaluated0.props = undefined;
}
if(evaluated0.dynamicItems){
evaluated0.items = undefined;
}
if(errors === 0){
if(data && typeof data == "object" && !Array.isArray(data)){
let missing0;
if((((((((((((((((((data.id === undefined) && (missing0 = "id")) || ((data.kind === undefined) && (missing0 = "kind"))) || ((data.created_at === undefined) && (missing0 = "created_at"))) || ((data.updated_at === undefined) && (missing0 = "updated_at"))) || ((data.rev === undefined) && (missing0 = "rev"))) || ((data.device === undefined) && (missing0 = "device"))) || ((data.deleted === undefined) && (missing0 = "deleted"))) || ((data.history === undefined) && (missing0 = "history"))) || ((data.series_id === undefined) && (missing0 = "series_id"))) || ((data.seq === undefined) && (missing0 = "seq"))) || ((data.raw === undefined) && (missing0 = "raw"))) || ((data.time_s === undefined) && (missing0 = "time_s"))) || ((data.height_m === undefined) && (missing0 = "height_m"))) || ((data.excluded === undefined) && (missing0 = "excluded"))) || ((data.exclusion_reason === undefined) && (missing0 = "exclusion_reason"))) || ((data.note === undefined) && (missing0 = "note"))) || ((data.captured_at === undefined) && (missing0 = "captured_at"))){
validate38.errors = [{instancePath,schemaPath:"#/required",keyword:"required",params:{missingProperty: missing0},message:"must have required property '"+missing0+"'"}];
return false;
}
else {
const _errs1 = errors;
for(const key0 in data){
if(!(func1.call(schema79.properties, key0))){
validate38.errors = [{instancePath,schemaPath:"#/additionalProperties",keyword:"additionalProperties",params:{additionalProperty: key0},message:"must NOT have additional properties"}];
return false;
break;
}
}
if(_errs1 === errors){
if(data.id !== undefined){
let data0 = data.id;
const _errs2 = errors;
const _errs3 = errors;
if(errors === _errs3){
if(typeof data0 === "string"){
if(!pattern5.test(data0)){
validate38.errors = [{instancePath:instancePath+"/id",schemaPath:"#/$defs/id/pattern",keyword:"pattern",params:{pattern: "^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"},message:"must match pattern \""+"^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"+"\""}];
return false;
}
}
else {
validate38.errors = [{instancePath:instancePath+"/id",schemaPath:"#/$defs/id/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs2 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.kind !== undefined){
const _errs5 = errors;
if("drop" !== data.kind){
validate38.errors = [{instancePath:instancePath+"/kind",schemaPath:"#/properties/kind/const",keyword:"const",params:{allowedValue: "drop"},message:"must be equal to constant"}];
return false;
}
var valid0 = _errs5 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.created_at !== undefined){
let data2 = data.created_at;
const _errs6 = errors;
const _errs7 = errors;
if(errors === _errs7){
if(typeof data2 === "string"){
if(!pattern9.test(data2)){
validate38.errors = [{instancePath:instancePath+"/created_at",schemaPath:"#/$defs/instant/pattern",keyword:"pattern",params:{pattern: "^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"},message:"must match pattern \""+"^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"+"\""}];
return false;
}
}
else {
validate38.errors = [{instancePath:instancePath+"/created_at",schemaPath:"#/$defs/instant/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs6 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.updated_at !== undefined){
let data3 = data.updated_at;
const _errs9 = errors;
const _errs10 = errors;
if(errors === _errs10){
if(typeof data3 === "string"){
if(!pattern9.test(data3)){
validate38.errors = [{instancePath:instancePath+"/updated_at",schemaPath:"#/$defs/instant/pattern",keyword:"pattern",params:{pattern: "^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"},message:"must match pattern \""+"^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"+"\""}];
return false;
}
}
else {
validate38.errors = [{instancePath:instancePath+"/updated_at",schemaPath:"#/$defs/instant/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs9 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.rev !== undefined){
let data4 = data.rev;
const _errs12 = errors;
const _errs13 = errors;
if(errors === _errs13){
if(typeof data4 === "string"){
if(!pattern11.test(data4)){
validate38.errors = [{instancePath:instancePath+"/rev",schemaPath:"#/$defs/rev/pattern",keyword:"pattern",params:{pattern: "^\\d{15}-\\d{6}-[A-Za-z0-9_.:]+$"},message:"must match pattern \""+"^\\d{15}-\\d{6}-[A-Za-z0-9_.:]+$"+"\""}];
return false;
}
}
else {
validate38.errors = [{instancePath:instancePath+"/rev",schemaPath:"#/$defs/rev/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs12 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.device !== undefined){
let data5 = data.device;
const _errs15 = errors;
const _errs16 = errors;
if(errors === _errs16){
if(typeof data5 === "string"){
if(!pattern4.test(data5)){
validate38.errors = [{instancePath:instancePath+"/device",schemaPath:"#/$defs/device/pattern",keyword:"pattern",params:{pattern: "^[A-Za-z0-9_.:]+$"},message:"must match pattern \""+"^[A-Za-z0-9_.:]+$"+"\""}];
return false;
}
}
else {
validate38.errors = [{instancePath:instancePath+"/device",schemaPath:"#/$defs/device/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs15 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.deleted !== undefined){
const _errs18 = errors;
if(typeof data.deleted !== "boolean"){
validate38.errors = [{instancePath:instancePath+"/deleted",schemaPath:"#/properties/deleted/type",keyword:"type",params:{type: "boolean"},message:"must be boolean"}];
return false;
}
var valid0 = _errs18 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.history !== undefined){
let data7 = data.history;
const _errs20 = errors;
if(errors === _errs20){
if(Array.isArray(data7)){
var valid6 = true;
const len0 = data7.length;
for(let i0=0; i0<len0; i0++){
const _errs22 = errors;
if(!(validate23(data7[i0], {instancePath:instancePath+"/history/" + i0,parentData:data7,parentDataProperty:i0,rootData,dynamicAnchors}))){
vErrors = vErrors === null ? validate23.errors : vErrors.concat(validate23.errors);
errors = vErrors.length;
}
var valid6 = _errs22 === errors;
if(!valid6){
break;
}
}
}
else {
validate38.errors = [{instancePath:instancePath+"/history",schemaPath:"#/properties/history/type",keyword:"type",params:{type: "array"},message:"must be array"}];
return false;
}
}
var valid0 = _errs20 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.series_id !== undefined){
let data9 = data.series_id;
const _errs23 = errors;
const _errs24 = errors;
if(errors === _errs24){
if(typeof data9 === "string"){
if(!pattern5.test(data9)){
validate38.errors = [{instancePath:instancePath+"/series_id",schemaPath:"#/$defs/id/pattern",keyword:"pattern",params:{pattern: "^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"},message:"must match pattern \""+"^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"+"\""}];
return false;
}
}
else {
validate38.errors = [{instancePath:instancePath+"/series_id",schemaPath:"#/$defs/id/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs23 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.seq !== undefined){
let data10 = data.seq;
const _errs26 = errors;
if(!(((typeof data10 == "number") && (!(data10 % 1) && !isNaN(data10))) && (isFinite(data10)))){
validate38.errors = [{instancePath:instancePath+"/seq",schemaPath:"#/properties/seq/type",keyword:"type",params:{type: "integer"},message:"must be integer"}];
return false;
}
if(errors === _errs26){
if((typeof data10 == "number") && (isFinite(data10))){
if(data10 < 1 || isNaN(data10)){
validate38.errors = [{instancePath:instancePath+"/seq",schemaPath:"#/properties/seq/minimum",keyword:"minimum",params:{comparison: ">=", limit: 1},message:"must be >= 1"}];
return false;
}
}
}
var valid0 = _errs26 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.raw !== undefined){
let data11 = data.raw;
const _errs28 = errors;
const _errs30 = errors;
const _errs31 = errors;
let valid9 = true;
const _errs32 = errors;
if(data11 && typeof data11 == "object" && !Array.isArray(data11)){
let missing1;
if((data11.kind === undefined) && (missing1 = "kind")){
const err0 = {};
if(vErrors === null){
vErrors = [err0];
}
else {
vErrors.push(err0);
}
errors++;
}
else {
if(data11.kind !== undefined){
if("typed" !== data11.kind){
const err1 = {};
if(vErrors === null){
vErrors = [err1];
}
else {
vErrors.push(err1);
}
errors++;
}
}
}
}
var _valid0 = _errs32 === errors;
errors = _errs31;
if(vErrors !== null){
if(_errs31){
vErrors.length = _errs31;
}
else {
vErrors = null;
}
}
if(_valid0){
const _errs34 = errors;
if(errors === _errs34){
if(data11 && typeof data11 == "object" && !Array.isArray(data11)){
let missing2;
if(((data11.kind === undefined) && (missing2 = "kind")) || ((data11.text === undefined) && (missing2 = "text"))){
validate38.errors = [{instancePath:instancePath+"/raw",schemaPath:"#/properties/raw/allOf/0/then/required",keyword:"required",params:{missingProperty: missing2},message:"must have required property '"+missing2+"'"}];
return false;
}
else {
const _errs36 = errors;
for(const key1 in data11){
if(!((key1 === "kind") || (key1 === "text"))){
validate38.errors = [{instancePath:instancePath+"/raw",schemaPath:"#/properties/raw/allOf/0/then/additionalProperties",keyword:"additionalProperties",params:{additionalProperty: key1},message:"must NOT have additional properties"}];
return false;
break;
}
}
if(_errs36 === errors){
if(data11.kind !== undefined){
const _errs37 = errors;
if("typed" !== data11.kind){
validate38.errors = [{instancePath:instancePath+"/raw/kind",schemaPath:"#/properties/raw/allOf/0/then/properties/kind/const",keyword:"const",params:{allowedValue: "typed"},message:"must be equal to constant"}];
return false;
}
var valid11 = _errs37 === errors;
}
else {
var valid11 = true;
}
if(valid11){
if(data11.text !== undefined){
const _errs38 = errors;
if(typeof data11.text !== "string"){
validate38.errors = [{instancePath:instancePath+"/raw/text",schemaPath:"#/properties/raw/allOf/0/then/properties/text/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
var valid11 = _errs38 === errors;
}
else {
var valid11 = true;
}
}
}
}
}
else {
validate38.errors = [{instancePath:instancePath+"/raw",schemaPath:"#/properties/raw/allOf/0/then/type",keyword:"type",params:{type: "object"},message:"must be object"}];
return false;
}
}
var _valid0 = _errs34 === errors;
valid9 = _valid0;
if(valid9){
var props0 = true;
}
}
if(!valid9){
const err2 = {instancePath:instancePath+"/raw",schemaPath:"#/properties/raw/allOf/0/if",keyword:"if",params:{failingKeyword: "then"},message:"must match \"then\" schema"};
if(vErrors === null){
vErrors = [err2];
}
else {
vErrors.push(err2);
}
errors++;
validate38.errors = vErrors;
return false;
}
var valid8 = _errs30 === errors;
if(valid8){
const _errs40 = errors;
const _errs41 = errors;
let valid12 = true;
const _errs42 = errors;
if(data11 && typeof data11 == "object" && !Array.isArray(data11)){
let missing3;
if((data11.kind === undefined) && (missing3 = "kind")){
const err3 = {};
if(vErrors === null){
vErrors = [err3];
}
else {
vErrors.push(err3);
}
errors++;
}
else {
if(data11.kind !== undefined){
if("taps" !== data11.kind){
const err4 = {};
if(vErrors === null){
vErrors = [err4];
}
else {
vErrors.push(err4);
}
errors++;
}
}
}
}
var _valid1 = _errs42 === errors;
errors = _errs41;
if(vErrors !== null){
if(_errs41){
vErrors.length = _errs41;
}
else {
vErrors = null;
}
}
if(_valid1){
const _errs44 = errors;
if(errors === _errs44){
if(data11 && typeof data11 == "object" && !Array.isArray(data11)){
let missing4;
if(((data11.kind === undefined) && (missing4 = "kind")) || ((data11.timestamps_ms === undefined) && (missing4 = "timestamps_ms"))){
validate38.errors = [{instancePath:instancePath+"/raw",schemaPath:"#/properties/raw/allOf/1/then/required",keyword:"required",params:{missingProperty: missing4},message:"must have required property '"+missing4+"'"}];
return false;
}
else {
const _errs46 = errors;
for(const key2 in data11){
if(!((key2 === "kind") || (key2 === "timestamps_ms"))){
validate38.errors = [{instancePath:instancePath+"/raw",schemaPath:"#/properties/raw/allOf/1/then/additionalProperties",keyword:"additionalProperties",params:{additionalProperty: key2},message:"must NOT have additional properties"}];
return false;
break;
}
}
if(_errs46 === errors){
if(data11.kind !== undefined){
const _errs47 = errors;
if("taps" !== data11.kind){
validate38.errors = [{instancePath:instancePath+"/raw/kind",schemaPath:"#/properties/raw/allOf/1/then/properties/kind/const",keyword:"const",params:{allowedValue: "taps"},message:"must be equal to constant"}];
return false;
}
var valid14 = _errs47 === errors;
}
else {
var valid14 = true;
}
if(valid14){
if(data11.timestamps_ms !== undefined){
let data17 = data11.timestamps_ms;
const _errs48 = errors;
if(errors === _errs48){
if(Array.isArray(data17)){
if(data17.length < 2){
validate38.errors = [{instancePath:instancePath+"/raw/timestamps_ms",schemaPath:"#/properties/raw/allOf/1/then/properties/timestamps_ms/minItems",keyword:"minItems",params:{limit: 2},message:"must NOT have fewer than 2 items"}];
return false;
}
else {
var valid15 = true;
const len1 = data17.length;
for(let i1=0; i1<len1; i1++){
let data18 = data17[i1];
const _errs50 = errors;
if(errors === _errs50){
if((typeof data18 == "number") && (isFinite(data18))){
if(data18 < 0 || isNaN(data18)){
validate38.errors = [{instancePath:instancePath+"/raw/timestamps_ms/" + i1,schemaPath:"#/properties/raw/allOf/1/then/properties/timestamps_ms/items/minimum",keyword:"minimum",params:{comparison: ">=", limit: 0},message:"must be >= 0"}];
return false;
}
}
else {
validate38.errors = [{instancePath:instancePath+"/raw/timestamps_ms/" + i1,schemaPath:"#/properties/raw/allOf/1/then/properties/timestamps_ms/items/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid15 = _errs50 === errors;
if(!valid15){
break;
}
}
}
}
else {
validate38.errors = [{instancePath:instancePath+"/raw/timestamps_ms",schemaPath:"#/properties/raw/allOf/1/then/properties/timestamps_ms/type",keyword:"type",params:{type: "array"},message:"must be array"}];
return false;
}
}
var valid14 = _errs48 === errors;
}
else {
var valid14 = true;
}
}
}
}
}
else {
validate38.errors = [{instancePath:instancePath+"/raw",schemaPath:"#/properties/raw/allOf/1/then/type",keyword:"type",params:{type: "object"},message:"must be object"}];
return false;
}
}
var _valid1 = _errs44 === errors;
valid12 = _valid1;
if(valid12){
var props1 = true;
}
}
if(!valid12){
const err5 = {instancePath:instancePath+"/raw",schemaPath:"#/properties/raw/allOf/1/if",keyword:"if",params:{failingKeyword: "then"},message:"must match \"then\" schema"};
if(vErrors === null){
vErrors = [err5];
}
else {
vErrors.push(err5);
}
errors++;
validate38.errors = vErrors;
return false;
}
var valid8 = _errs40 === errors;
if(valid8){
if(props0 !== true && props1 !== undefined){
if(props1 === true){
props0 = true;
}
else {
props0 = props0 || {};
Object.assign(props0, props1);
}
}
const _errs52 = errors;
const _errs53 = errors;
let valid16 = true;
const _errs54 = errors;
if(data11 && typeof data11 == "object" && !Array.isArray(data11)){
let missing5;
if((data11.kind === undefined) && (missing5 = "kind")){
const err6 = {};
if(vErrors === null){
vErrors = [err6];
}
else {
vErrors.push(err6);
}
errors++;
}
else {
if(data11.kind !== undefined){
if("sound" !== data11.kind){
const err7 = {};
if(vErrors === null){
vErrors = [err7];
}
else {
vErrors.push(err7);
}
errors++;
}
}
}
}
var _valid2 = _errs54 === errors;
errors = _errs53;
if(vErrors !== null){
if(_errs53){
vErrors.length = _errs53;
}
else {
vErrors = null;
}
}
if(_valid2){
const _errs56 = errors;
if(errors === _errs56){
if(data11 && typeof data11 == "object" && !Array.isArray(data11)){
let missing6;
if((((data11.kind === undefined) && (missing6 = "kind")) || ((data11.onsets_s === undefined) && (missing6 = "onsets_s"))) || ((data11.sample_rate_Hz === undefined) && (missing6 = "sample_rate_Hz"))){
validate38.errors = [{instancePath:instancePath+"/raw",schemaPath:"#/properties/raw/allOf/2/then/required",keyword:"required",params:{missingProperty: missing6},message:"must have required property '"+missing6+"'"}];
return false;
}
else {
const _errs58 = errors;
for(const key3 in data11){
if(!(((key3 === "kind") || (key3 === "onsets_s")) || (key3 === "sample_rate_Hz"))){
validate38.errors = [{instancePath:instancePath+"/raw",schemaPath:"#/properties/raw/allOf/2/then/additionalProperties",keyword:"additionalProperties",params:{additionalProperty: key3},message:"must NOT have additional properties"}];
return false;
break;
}
}
if(_errs58 === errors){
if(data11.kind !== undefined){
const _errs59 = errors;
if("sound" !== data11.kind){
validate38.errors = [{instancePath:instancePath+"/raw/kind",schemaPath:"#/properties/raw/allOf/2/then/properties/kind/const",keyword:"const",params:{allowedValue: "sound"},message:"must be equal to constant"}];
return false;
}
var valid18 = _errs59 === errors;
}
else {
var valid18 = true;
}
if(valid18){
if(data11.onsets_s !== undefined){
let data21 = data11.onsets_s;
const _errs60 = errors;
if(errors === _errs60){
if(Array.isArray(data21)){
if(data21.length < 2){
validate38.errors = [{instancePath:instancePath+"/raw/onsets_s",schemaPath:"#/properties/raw/allOf/2/then/properties/onsets_s/minItems",keyword:"minItems",params:{limit: 2},message:"must NOT have fewer than 2 items"}];
return false;
}
else {
var valid19 = true;
const len2 = data21.length;
for(let i2=0; i2<len2; i2++){
let data22 = data21[i2];
const _errs62 = errors;
if(errors === _errs62){
if((typeof data22 == "number") && (isFinite(data22))){
if(data22 < 0 || isNaN(data22)){
validate38.errors = [{instancePath:instancePath+"/raw/onsets_s/" + i2,schemaPath:"#/properties/raw/allOf/2/then/properties/onsets_s/items/minimum",keyword:"minimum",params:{comparison: ">=", limit: 0},message:"must be >= 0"}];
return false;
}
}
else {
validate38.errors = [{instancePath:instancePath+"/raw/onsets_s/" + i2,schemaPath:"#/properties/raw/allOf/2/then/properties/onsets_s/items/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid19 = _errs62 === errors;
if(!valid19){
break;
}
}
}
}
else {
validate38.errors = [{instancePath:instancePath+"/raw/onsets_s",schemaPath:"#/properties/raw/allOf/2/then/properties/onsets_s/type",keyword:"type",params:{type: "array"},message:"must be array"}];
return false;
}
}
var valid18 = _errs60 === errors;
}
else {
var valid18 = true;
}
if(valid18){
if(data11.sample_rate_Hz !== undefined){
let data23 = data11.sample_rate_Hz;
const _errs64 = errors;
if(errors === _errs64){
if((typeof data23 == "number") && (isFinite(data23))){
if(data23 > 384000 || isNaN(data23)){
validate38.errors = [{instancePath:instancePath+"/raw/sample_rate_Hz",schemaPath:"#/properties/raw/allOf/2/then/properties/sample_rate_Hz/maximum",keyword:"maximum",params:{comparison: "<=", limit: 384000},message:"must be <= 384000"}];
return false;
}
else {
if(data23 <= 0 || isNaN(data23)){
validate38.errors = [{instancePath:instancePath+"/raw/sample_rate_Hz",schemaPath:"#/properties/raw/allOf/2/then/properties/sample_rate_Hz/exclusiveMinimum",keyword:"exclusiveMinimum",params:{comparison: ">", limit: 0},message:"must be > 0"}];
return false;
}
}
}
else {
validate38.errors = [{instancePath:instancePath+"/raw/sample_rate_Hz",schemaPath:"#/properties/raw/allOf/2/then/properties/sample_rate_Hz/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid18 = _errs64 === errors;
}
else {
var valid18 = true;
}
}
}
}
}
}
else {
validate38.errors = [{instancePath:instancePath+"/raw",schemaPath:"#/properties/raw/allOf/2/then/type",keyword:"type",params:{type: "object"},message:"must be object"}];
return false;
}
}
var _valid2 = _errs56 === errors;
valid16 = _valid2;
if(valid16){
var props2 = true;
}
}
if(!valid16){
const err8 = {instancePath:instancePath+"/raw",schemaPath:"#/properties/raw/allOf/2/if",keyword:"if",params:{failingKeyword: "then"},message:"must match \"then\" schema"};
if(vErrors === null){
vErrors = [err8];
}
else {
vErrors.push(err8);
}
errors++;
validate38.errors = vErrors;
return false;
}
var valid8 = _errs52 === errors;
if(valid8){
if(props0 !== true && props2 !== undefined){
if(props2 === true){
props0 = true;
}
else {
props0 = props0 || {};
Object.assign(props0, props2);
}
}
const _errs66 = errors;
const _errs67 = errors;
let valid20 = true;
const _errs68 = errors;
if(data11 && typeof data11 == "object" && !Array.isArray(data11)){
let missing7;
if((data11.kind === undefined) && (missing7 = "kind")){
const err9 = {};
if(vErrors === null){
vErrors = [err9];
}
else {
vErrors.push(err9);
}
errors++;
}
else {
if(data11.kind !== undefined){
if("frames" !== data11.kind){
const err10 = {};
if(vErrors === null){
vErrors = [err10];
}
else {
vErrors.push(err10);
}
errors++;
}
}
}
}
var _valid3 = _errs68 === errors;
errors = _errs67;
if(vErrors !== null){
if(_errs67){
vErrors.length = _errs67;
}
else {
vErrors = null;
}
}
if(_valid3){
const _errs70 = errors;
if(errors === _errs70){
if(data11 && typeof data11 == "object" && !Array.isArray(data11)){
let missing8;
if((((data11.kind === undefined) && (missing8 = "kind")) || ((data11.frames === undefined) && (missing8 = "frames"))) || ((data11.frame_rate_Hz === undefined) && (missing8 = "frame_rate_Hz"))){
validate38.errors = [{instancePath:instancePath+"/raw",schemaPath:"#/properties/raw/allOf/3/then/required",keyword:"required",params:{missingProperty: missing8},message:"must have required property '"+missing8+"'"}];
return false;
}
else {
const _errs72 = errors;
for(const key4 in data11){
if(!(((key4 === "kind") || (key4 === "frames")) || (key4 === "frame_rate_Hz"))){
validate38.errors = [{instancePath:instancePath+"/raw",schemaPath:"#/properties/raw/allOf/3/then/additionalProperties",keyword:"additionalProperties",params:{additionalProperty: key4},message:"must NOT have additional properties"}];
return false;
break;
}
}
if(_errs72 === errors){
if(data11.kind !== undefined){
const _errs73 = errors;
if("frames" !== data11.kind){
validate38.errors = [{instancePath:instancePath+"/raw/kind",schemaPath:"#/properties/raw/allOf/3/then/properties/kind/const",keyword:"const",params:{allowedValue: "frames"},message:"must be equal to constant"}];
return false;
}
var valid22 = _errs73 === errors;
}
else {
var valid22 = true;
}
if(valid22){
if(data11.frames !== undefined){
let data26 = data11.frames;
const _errs74 = errors;
if(errors === _errs74){
if(Array.isArray(data26)){
if(data26.length < 2){
validate38.errors = [{instancePath:instancePath+"/raw/frames",schemaPath:"#/properties/raw/allOf/3/then/properties/frames/minItems",keyword:"minItems",params:{limit: 2},message:"must NOT have fewer than 2 items"}];
return false;
}
else {
var valid23 = true;
const len3 = data26.length;
for(let i3=0; i3<len3; i3++){
let data27 = data26[i3];
const _errs76 = errors;
if(!(((typeof data27 == "number") && (!(data27 % 1) && !isNaN(data27))) && (isFinite(data27)))){
validate38.errors = [{instancePath:instancePath+"/raw/frames/" + i3,schemaPath:"#/properties/raw/allOf/3/then/properties/frames/items/type",keyword:"type",params:{type: "integer"},message:"must be integer"}];
return false;
}
if(errors === _errs76){
if((typeof data27 == "number") && (isFinite(data27))){
if(data27 < 0 || isNaN(data27)){
validate38.errors = [{instancePath:instancePath+"/raw/frames/" + i3,schemaPath:"#/properties/raw/allOf/3/then/properties/frames/items/minimum",keyword:"minimum",params:{comparison: ">=", limit: 0},message:"must be >= 0"}];
return false;
}
}
}
var valid23 = _errs76 === errors;
if(!valid23){
break;
}
}
}
}
else {
validate38.errors = [{instancePath:instancePath+"/raw/frames",schemaPath:"#/properties/raw/allOf/3/then/properties/frames/type",keyword:"type",params:{type: "array"},message:"must be array"}];
return false;
}
}
var valid22 = _errs74 === errors;
}
else {
var valid22 = true;
}
if(valid22){
if(data11.frame_rate_Hz !== undefined){
let data28 = data11.frame_rate_Hz;
const _errs78 = errors;
if(errors === _errs78){
if((typeof data28 == "number") && (isFinite(data28))){
if(data28 > 1000000 || isNaN(data28)){
validate38.errors = [{instancePath:instancePath+"/raw/frame_rate_Hz",schemaPath:"#/properties/raw/allOf/3/then/properties/frame_rate_Hz/maximum",keyword:"maximum",params:{comparison: "<=", limit: 1000000},message:"must be <= 1000000"}];
return false;
}
else {
if(data28 <= 0 || isNaN(data28)){
validate38.errors = [{instancePath:instancePath+"/raw/frame_rate_Hz",schemaPath:"#/properties/raw/allOf/3/then/properties/frame_rate_Hz/exclusiveMinimum",keyword:"exclusiveMinimum",params:{comparison: ">", limit: 0},message:"must be > 0"}];
return false;
}
}
}
else {
validate38.errors = [{instancePath:instancePath+"/raw/frame_rate_Hz",schemaPath:"#/properties/raw/allOf/3/then/properties/frame_rate_Hz/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid22 = _errs78 === errors;
}
else {
var valid22 = true;
}
}
}
}
}
}
else {
validate38.errors = [{instancePath:instancePath+"/raw",schemaPath:"#/properties/raw/allOf/3/then/type",keyword:"type",params:{type: "object"},message:"must be object"}];
return false;
}
}
var _valid3 = _errs70 === errors;
valid20 = _valid3;
if(valid20){
var props3 = true;
}
}
if(!valid20){
const err11 = {instancePath:instancePath+"/raw",schemaPath:"#/properties/raw/allOf/3/if",keyword:"if",params:{failingKeyword: "then"},message:"must match \"then\" schema"};
if(vErrors === null){
vErrors = [err11];
}
else {
vErrors.push(err11);
}
errors++;
validate38.errors = vErrors;
return false;
}
var valid8 = _errs66 === errors;
if(valid8){
if(props0 !== true && props3 !== undefined){
if(props3 === true){
props0 = true;
}
else {
props0 = props0 || {};
Object.assign(props0, props3);
}
}
}
}
}
}
if(errors === _errs28){
if(data11 && typeof data11 == "object" && !Array.isArray(data11)){
let missing9;
if((data11.kind === undefined) && (missing9 = "kind")){
validate38.errors = [{instancePath:instancePath+"/raw",schemaPath:"#/properties/raw/required",keyword:"required",params:{missingProperty: missing9},message:"must have required property '"+missing9+"'"}];
return false;
}
else {
if(props0 !== true){
props0 = props0 || {};
props0.kind = true;
}
if(data11.kind !== undefined){
let data29 = data11.kind;
if(typeof data29 !== "string"){
validate38.errors = [{instancePath:instancePath+"/raw/kind",schemaPath:"#/properties/raw/properties/kind/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
if(!((((data29 === "typed") || (data29 === "taps")) || (data29 === "sound")) || (data29 === "frames"))){
validate38.errors = [{instancePath:instancePath+"/raw/kind",schemaPath:"#/properties/raw/properties/kind/enum",keyword:"enum",params:{allowedValues: schema79.properties.raw.properties.kind.enum},message:"must be equal to one of the allowed values"}];
return false;
}
}
}
}
else {
validate38.errors = [{instancePath:instancePath+"/raw",schemaPath:"#/properties/raw/type",keyword:"type",params:{type: "object"},message:"must be object"}];
return false;
}
}
var valid0 = _errs28 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.time_s !== undefined){
let data30 = data.time_s;
const _errs82 = errors;
if(errors === _errs82){
if((typeof data30 == "number") && (isFinite(data30))){
if(data30 > 3600 || isNaN(data30)){
validate38.errors = [{instancePath:instancePath+"/time_s",schemaPath:"#/properties/time_s/maximum",keyword:"maximum",params:{comparison: "<=", limit: 3600},message:"must be <= 3600"}];
return false;
}
else {
if(data30 <= 0 || isNaN(data30)){
validate38.errors = [{instancePath:instancePath+"/time_s",schemaPath:"#/properties/time_s/exclusiveMinimum",keyword:"exclusiveMinimum",params:{comparison: ">", limit: 0},message:"must be > 0"}];
return false;
}
}
}
else {
validate38.errors = [{instancePath:instancePath+"/time_s",schemaPath:"#/properties/time_s/type",keyword:"type",params:{type: "number"},message:"must be number"}];
return false;
}
}
var valid0 = _errs82 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.height_m !== undefined){
let data31 = data.height_m;
const _errs84 = errors;
const _errs85 = errors;
let valid25 = false;
const _errs86 = errors;
if(errors === _errs86){
if((typeof data31 == "number") && (isFinite(data31))){
if(data31 > 1000 || isNaN(data31)){
const err12 = {instancePath:instancePath+"/height_m",schemaPath:"#/properties/height_m/anyOf/0/maximum",keyword:"maximum",params:{comparison: "<=", limit: 1000},message:"must be <= 1000"};
if(vErrors === null){
vErrors = [err12];
}
else {
vErrors.push(err12);
}
errors++;
}
else {
if(data31 <= 0 || isNaN(data31)){
const err13 = {instancePath:instancePath+"/height_m",schemaPath:"#/properties/height_m/anyOf/0/exclusiveMinimum",keyword:"exclusiveMinimum",params:{comparison: ">", limit: 0},message:"must be > 0"};
if(vErrors === null){
vErrors = [err13];
}
else {
vErrors.push(err13);
}
errors++;
}
}
}
else {
const err14 = {instancePath:instancePath+"/height_m",schemaPath:"#/properties/height_m/anyOf/0/type",keyword:"type",params:{type: "number"},message:"must be number"};
if(vErrors === null){
vErrors = [err14];
}
else {
vErrors.push(err14);
}
errors++;
}
}
var _valid4 = _errs86 === errors;
valid25 = valid25 || _valid4;
const _errs88 = errors;
if(data31 !== null){
const err15 = {instancePath:instancePath+"/height_m",schemaPath:"#/properties/height_m/anyOf/1/type",keyword:"type",params:{type: "null"},message:"must be null"};
if(vErrors === null){
vErrors = [err15];
}
else {
vErrors.push(err15);
}
errors++;
}
var _valid4 = _errs88 === errors;
valid25 = valid25 || _valid4;
if(!valid25){
const err16 = {instancePath:instancePath+"/height_m",schemaPath:"#/properties/height_m/anyOf",keyword:"anyOf",params:{},message:"must match a schema in anyOf"};
if(vErrors === null){
vErrors = [err16];
}
else {
vErrors.push(err16);
}
errors++;
validate38.errors = vErrors;
return false;
}
else {
errors = _errs85;
if(vErrors !== null){
if(_errs85){
vErrors.length = _errs85;
}
else {
vErrors = null;
}
}
}
var valid0 = _errs84 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.excluded !== undefined){
const _errs90 = errors;
if(typeof data.excluded !== "boolean"){
validate38.errors = [{instancePath:instancePath+"/excluded",schemaPath:"#/properties/excluded/type",keyword:"type",params:{type: "boolean"},message:"must be boolean"}];
return false;
}
var valid0 = _errs90 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.exclusion_reason !== undefined){
let data33 = data.exclusion_reason;
const _errs92 = errors;
const _errs93 = errors;
let valid26 = false;
const _errs94 = errors;
if(typeof data33 !== "string"){
const err17 = {instancePath:instancePath+"/exclusion_reason",schemaPath:"#/properties/exclusion_reason/anyOf/0/type",keyword:"type",params:{type: "string"},message:"must be string"};
if(vErrors === null){
vErrors = [err17];
}
else {
vErrors.push(err17);
}
errors++;
}
var _valid5 = _errs94 === errors;
valid26 = valid26 || _valid5;
const _errs96 = errors;
if(data33 !== null){
const err18 = {instancePath:instancePath+"/exclusion_reason",schemaPath:"#/properties/exclusion_reason/anyOf/1/type",keyword:"type",params:{type: "null"},message:"must be null"};
if(vErrors === null){
vErrors = [err18];
}
else {
vErrors.push(err18);
}
errors++;
}
var _valid5 = _errs96 === errors;
valid26 = valid26 || _valid5;
if(!valid26){
const err19 = {instancePath:instancePath+"/exclusion_reason",schemaPath:"#/properties/exclusion_reason/anyOf",keyword:"anyOf",params:{},message:"must match a schema in anyOf"};
if(vErrors === null){
vErrors = [err19];
}
else {
vErrors.push(err19);
}
errors++;
validate38.errors = vErrors;
return false;
}
else {
errors = _errs93;
if(vErrors !== null){
if(_errs93){
vErrors.length = _errs93;
}
else {
vErrors = null;
}
}
}
var valid0 = _errs92 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.note !== undefined){
const _errs98 = errors;
if(typeof data.note !== "string"){
validate38.errors = [{instancePath:instancePath+"/note",schemaPath:"#/properties/note/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
var valid0 = _errs98 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.captured_at !== undefined){
let data35 = data.captured_at;
const _errs100 = errors;
const _errs101 = errors;
if(errors === _errs101){
if(typeof data35 === "string"){
if(!pattern9.test(data35)){
validate38.errors = [{instancePath:instancePath+"/captured_at",schemaPath:"#/$defs/instant/pattern",keyword:"pattern",params:{pattern: "^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"},message:"must match pattern \""+"^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}(\\.\\d{1,3})?Z$"+"\""}];
return false;
}
}
else {
validate38.errors = [{instancePath:instancePath+"/captured_at",schemaPath:"#/$defs/instant/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs100 === errors;
}
else {
var valid0 = true;
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
}
else {
validate38.errors = [{instancePath,schemaPath:"#/type",keyword:"type",params:{type: "object"},message:"must be object"}];
return false;
}
}
validate38.errors = vErrors;
return errors === 0;
}
validate38.evaluated = {"props":true,"dynamicProps":false,"dynamicItems":false};


function validate21(data, {instancePath="", parentData, parentDataProperty, rootData=data, dynamicAnchors={}}={}){
let vErrors = null;
let errors = 0;
const evaluated0 = validate21.evaluated;
if(evaluated0.dynamicProps){
evaluated0.props = undefined;
}
if(evaluated0.dynamicItems){
evaluated0.items = undefined;
}
const _errs1 = errors;
const _errs2 = errors;
let valid1 = true;
const _errs3 = errors;
if(data && typeof data == "object" && !Array.isArray(data)){
let missing0;
if((data.kind === undefined) && (missing0 = "kind")){
const err0 = {};
if(vErrors === null){
vErrors = [err0];
}
else {
vErrors.push(err0);
}
errors++;
}
else {
if(data.kind !== undefined){
if("site" !== data.kind){
const err1 = {};
if(vErrors === null){
vErrors = [err1];
}
else {
vErrors.push(err1);
}
errors++;
}
}
}
}
var _valid0 = _errs3 === errors;
errors = _errs2;
if(vErrors !== null){
if(_errs2){
vErrors.length = _errs2;
}
else {
vErrors = null;
}
}
if(_valid0){
const _errs5 = errors;
if(!(validate22(data, {instancePath,parentData,parentDataProperty,rootData,dynamicAnchors}))){
vErrors = vErrors === null ? validate22.errors : vErrors.concat(validate22.errors);
errors = vErrors.length;
}
var _valid0 = _errs5 === errors;
valid1 = _valid0;
if(valid1){
var props0 = true;
}
}
if(!valid1){
const err2 = {instancePath,schemaPath:"#/allOf/0/if",keyword:"if",params:{failingKeyword: "then"},message:"must match \"then\" schema"};
if(vErrors === null){
vErrors = [err2];
}
else {
vErrors.push(err2);
}
errors++;
validate21.errors = vErrors;
return false;
}
var valid0 = _errs1 === errors;
if(valid0){
const _errs6 = errors;
const _errs7 = errors;
let valid3 = true;
const _errs8 = errors;
if(data && typeof data == "object" && !Array.isArray(data)){
let missing1;
if((data.kind === undefined) && (missing1 = "kind")){
const err3 = {};
if(vErrors === null){
vErrors = [err3];
}
else {
vErrors.push(err3);
}
errors++;
}
else {
if(data.kind !== undefined){
if("specimen" !== data.kind){
const err4 = {};
if(vErrors === null){
vErrors = [err4];
}
else {
vErrors.push(err4);
}
errors++;
}
}
}
}
var _valid1 = _errs8 === errors;
errors = _errs7;
if(vErrors !== null){
if(_errs7){
vErrors.length = _errs7;
}
else {
vErrors = null;
}
}
if(_valid1){
const _errs10 = errors;
if(!(validate26(data, {instancePath,parentData,parentDataProperty,rootData,dynamicAnchors}))){
vErrors = vErrors === null ? validate26.errors : vErrors.concat(validate26.errors);
errors = vErrors.length;
}
var _valid1 = _errs10 === errors;
valid3 = _valid1;
if(valid3){
var props1 = true;
}
}
if(!valid3){
const err5 = {instancePath,schemaPath:"#/allOf/1/if",keyword:"if",params:{failingKeyword: "then"},message:"must match \"then\" schema"};
if(vErrors === null){
vErrors = [err5];
}
else {
vErrors.push(err5);
}
errors++;
validate21.errors = vErrors;
return false;
}
var valid0 = _errs6 === errors;
if(valid0){
if(props0 !== true && props1 !== undefined){
if(props1 === true){
props0 = true;
}
else {
props0 = props0 || {};
Object.assign(props0, props1);
}
}
const _errs11 = errors;
const _errs12 = errors;
let valid5 = true;
const _errs13 = errors;
if(data && typeof data == "object" && !Array.isArray(data)){
let missing2;
if((data.kind === undefined) && (missing2 = "kind")){
const err6 = {};
if(vErrors === null){
vErrors = [err6];
}
else {
vErrors.push(err6);
}
errors++;
}
else {
if(data.kind !== undefined){
if("day" !== data.kind){
const err7 = {};
if(vErrors === null){
vErrors = [err7];
}
else {
vErrors.push(err7);
}
errors++;
}
}
}
}
var _valid2 = _errs13 === errors;
errors = _errs12;
if(vErrors !== null){
if(_errs12){
vErrors.length = _errs12;
}
else {
vErrors = null;
}
}
if(_valid2){
const _errs15 = errors;
if(!(validate29(data, {instancePath,parentData,parentDataProperty,rootData,dynamicAnchors}))){
vErrors = vErrors === null ? validate29.errors : vErrors.concat(validate29.errors);
errors = vErrors.length;
}
var _valid2 = _errs15 === errors;
valid5 = _valid2;
if(valid5){
var props2 = true;
}
}
if(!valid5){
const err8 = {instancePath,schemaPath:"#/allOf/2/if",keyword:"if",params:{failingKeyword: "then"},message:"must match \"then\" schema"};
if(vErrors === null){
vErrors = [err8];
}
else {
vErrors.push(err8);
}
errors++;
validate21.errors = vErrors;
return false;
}
var valid0 = _errs11 === errors;
if(valid0){
if(props0 !== true && props2 !== undefined){
if(props2 === true){
props0 = true;
}
else {
props0 = props0 || {};
Object.assign(props0, props2);
}
}
const _errs16 = errors;
const _errs17 = errors;
let valid7 = true;
const _errs18 = errors;
if(data && typeof data == "object" && !Array.isArray(data)){
let missing3;
if((data.kind === undefined) && (missing3 = "kind")){
const err9 = {};
if(vErrors === null){
vErrors = [err9];
}
else {
vErrors.push(err9);
}
errors++;
}
else {
if(data.kind !== undefined){
if("reading" !== data.kind){
const err10 = {};
if(vErrors === null){
vErrors = [err10];
}
else {
vErrors.push(err10);
}
errors++;
}
}
}
}
var _valid3 = _errs18 === errors;
errors = _errs17;
if(vErrors !== null){
if(_errs17){
vErrors.length = _errs17;
}
else {
vErrors = null;
}
}
if(_valid3){
const _errs20 = errors;
if(!(validate32(data, {instancePath,parentData,parentDataProperty,rootData,dynamicAnchors}))){
vErrors = vErrors === null ? validate32.errors : vErrors.concat(validate32.errors);
errors = vErrors.length;
}
var _valid3 = _errs20 === errors;
valid7 = _valid3;
if(valid7){
var props3 = true;
}
}
if(!valid7){
const err11 = {instancePath,schemaPath:"#/allOf/3/if",keyword:"if",params:{failingKeyword: "then"},message:"must match \"then\" schema"};
if(vErrors === null){
vErrors = [err11];
}
else {
vErrors.push(err11);
}
errors++;
validate21.errors = vErrors;
return false;
}
var valid0 = _errs16 === errors;
if(valid0){
if(props0 !== true && props3 !== undefined){
if(props3 === true){
props0 = true;
}
else {
props0 = props0 || {};
Object.assign(props0, props3);
}
}
const _errs21 = errors;
const _errs22 = errors;
let valid9 = true;
const _errs23 = errors;
if(data && typeof data == "object" && !Array.isArray(data)){
let missing4;
if((data.kind === undefined) && (missing4 = "kind")){
const err12 = {};
if(vErrors === null){
vErrors = [err12];
}
else {
vErrors.push(err12);
}
errors++;
}
else {
if(data.kind !== undefined){
if("series" !== data.kind){
const err13 = {};
if(vErrors === null){
vErrors = [err13];
}
else {
vErrors.push(err13);
}
errors++;
}
}
}
}
var _valid4 = _errs23 === errors;
errors = _errs22;
if(vErrors !== null){
if(_errs22){
vErrors.length = _errs22;
}
else {
vErrors = null;
}
}
if(_valid4){
const _errs25 = errors;
if(!(validate35(data, {instancePath,parentData,parentDataProperty,rootData,dynamicAnchors}))){
vErrors = vErrors === null ? validate35.errors : vErrors.concat(validate35.errors);
errors = vErrors.length;
}
var _valid4 = _errs25 === errors;
valid9 = _valid4;
if(valid9){
var props4 = true;
}
}
if(!valid9){
const err14 = {instancePath,schemaPath:"#/allOf/4/if",keyword:"if",params:{failingKeyword: "then"},message:"must match \"then\" schema"};
if(vErrors === null){
vErrors = [err14];
}
else {
vErrors.push(err14);
}
errors++;
validate21.errors = vErrors;
return false;
}
var valid0 = _errs21 === errors;
if(valid0){
if(props0 !== true && props4 !== undefined){
if(props4 === true){
props0 = true;
}
else {
props0 = props0 || {};
Object.assign(props0, props4);
}
}
const _errs26 = errors;
const _errs27 = errors;
let valid11 = true;
const _errs28 = errors;
if(data && typeof data == "object" && !Array.isArray(data)){
let missing5;
if((data.kind === undefined) && (missing5 = "kind")){
const err15 = {};
if(vErrors === null){
vErrors = [err15];
}
else {
vErrors.push(err15);
}
errors++;
}
else {
if(data.kind !== undefined){
if("drop" !== data.kind){
const err16 = {};
if(vErrors === null){
vErrors = [err16];
}
else {
vErrors.push(err16);
}
errors++;
}
}
}
}
var _valid5 = _errs28 === errors;
errors = _errs27;
if(vErrors !== null){
if(_errs27){
vErrors.length = _errs27;
}
else {
vErrors = null;
}
}
if(_valid5){
const _errs30 = errors;
if(!(validate38(data, {instancePath,parentData,parentDataProperty,rootData,dynamicAnchors}))){
vErrors = vErrors === null ? validate38.errors : vErrors.concat(validate38.errors);
errors = vErrors.length;
}
var _valid5 = _errs30 === errors;
valid11 = _valid5;
if(valid11){
var props5 = true;
}
}
if(!valid11){
const err17 = {instancePath,schemaPath:"#/allOf/5/if",keyword:"if",params:{failingKeyword: "then"},message:"must match \"then\" schema"};
if(vErrors === null){
vErrors = [err17];
}
else {
vErrors.push(err17);
}
errors++;
validate21.errors = vErrors;
return false;
}
var valid0 = _errs26 === errors;
if(valid0){
if(props0 !== true && props5 !== undefined){
if(props5 === true){
props0 = true;
}
else {
props0 = props0 || {};
Object.assign(props0, props5);
}
}
}
}
}
}
}
}
if(errors === 0){
if(data && typeof data == "object" && !Array.isArray(data)){
let missing6;
if((data.kind === undefined) && (missing6 = "kind")){
validate21.errors = [{instancePath,schemaPath:"#/required",keyword:"required",params:{missingProperty: missing6},message:"must have required property '"+missing6+"'"}];
return false;
}
else {
if(props0 !== true){
props0 = props0 || {};
props0.kind = true;
}
if(data.kind !== undefined){
let data6 = data.kind;
if(typeof data6 !== "string"){
validate21.errors = [{instancePath:instancePath+"/kind",schemaPath:"#/properties/kind/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
if(!((((((data6 === "site") || (data6 === "specimen")) || (data6 === "day")) || (data6 === "reading")) || (data6 === "series")) || (data6 === "drop"))){
validate21.errors = [{instancePath:instancePath+"/kind",schemaPath:"#/properties/kind/enum",keyword:"enum",params:{allowedValues: schema36.properties.kind.enum},message:"must be equal to one of the allowed values"}];
return false;
}
}
}
}
else {
validate21.errors = [{instancePath,schemaPath:"#/type",keyword:"type",params:{type: "object"},message:"must be object"}];
return false;
}
}
validate21.errors = vErrors;
evaluated0.props = props0;
return errors === 0;
}
validate21.evaluated = {"dynamicProps":true,"dynamicItems":false};


function validate20(data, {instancePath="", parentData, parentDataProperty, rootData=data, dynamicAnchors={}}={}){
/*# sourceURL="https://plummet.invalid/schema/plummet-log-1.schema.json" */;
let vErrors = null;
let errors = 0;
const evaluated0 = validate20.evaluated;
if(evaluated0.dynamicProps){
evaluated0.props = undefined;
}
if(evaluated0.dynamicItems){
evaluated0.items = undefined;
}
if(errors === 0){
if(data && typeof data == "object" && !Array.isArray(data)){
let missing0;
if(((((((data.format === undefined) && (missing0 = "format")) || ((data.format_version === undefined) && (missing0 = "format_version"))) || ((data.app_version === undefined) && (missing0 = "app_version"))) || ((data.device === undefined) && (missing0 = "device"))) || ((data.selection === undefined) && (missing0 = "selection"))) || ((data.records === undefined) && (missing0 = "records"))){
validate20.errors = [{instancePath,schemaPath:"#/required",keyword:"required",params:{missingProperty: missing0},message:"must have required property '"+missing0+"'"}];
return false;
}
else {
const _errs1 = errors;
for(const key0 in data){
if(!((((((key0 === "format") || (key0 === "format_version")) || (key0 === "app_version")) || (key0 === "device")) || (key0 === "selection")) || (key0 === "records"))){
validate20.errors = [{instancePath,schemaPath:"#/additionalProperties",keyword:"additionalProperties",params:{additionalProperty: key0},message:"must NOT have additional properties"}];
return false;
break;
}
}
if(_errs1 === errors){
if(data.format !== undefined){
const _errs2 = errors;
if("plummet-log" !== data.format){
validate20.errors = [{instancePath:instancePath+"/format",schemaPath:"#/properties/format/const",keyword:"const",params:{allowedValue: "plummet-log"},message:"must be equal to constant"}];
return false;
}
var valid0 = _errs2 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.format_version !== undefined){
const _errs3 = errors;
if(1 !== data.format_version){
validate20.errors = [{instancePath:instancePath+"/format_version",schemaPath:"#/properties/format_version/const",keyword:"const",params:{allowedValue: 1},message:"must be equal to constant"}];
return false;
}
var valid0 = _errs3 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.app_version !== undefined){
const _errs4 = errors;
if(typeof data.app_version !== "string"){
validate20.errors = [{instancePath:instancePath+"/app_version",schemaPath:"#/properties/app_version/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
var valid0 = _errs4 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.device !== undefined){
let data3 = data.device;
const _errs6 = errors;
const _errs7 = errors;
if(errors === _errs7){
if(typeof data3 === "string"){
if(!pattern4.test(data3)){
validate20.errors = [{instancePath:instancePath+"/device",schemaPath:"#/$defs/device/pattern",keyword:"pattern",params:{pattern: "^[A-Za-z0-9_.:]+$"},message:"must match pattern \""+"^[A-Za-z0-9_.:]+$"+"\""}];
return false;
}
}
else {
validate20.errors = [{instancePath:instancePath+"/device",schemaPath:"#/$defs/device/type",keyword:"type",params:{type: "string"},message:"must be string"}];
return false;
}
}
var valid0 = _errs6 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.selection !== undefined){
let data4 = data.selection;
const _errs9 = errors;
const _errs10 = errors;
let valid2 = false;
const _errs11 = errors;
if(errors === _errs11){
if(data4 && typeof data4 == "object" && !Array.isArray(data4)){
let missing1;
if(((((data4.day_ids === undefined) && (missing1 = "day_ids")) || ((data4.specimen_ids === undefined) && (missing1 = "specimen_ids"))) || ((data4.site_ids === undefined) && (missing1 = "site_ids"))) || ((data4.kinds === undefined) && (missing1 = "kinds"))){
const err0 = {instancePath:instancePath+"/selection",schemaPath:"#/properties/selection/anyOf/0/required",keyword:"required",params:{missingProperty: missing1},message:"must have required property '"+missing1+"'"};
if(vErrors === null){
vErrors = [err0];
}
else {
vErrors.push(err0);
}
errors++;
}
else {
const _errs13 = errors;
for(const key1 in data4){
if(!((((key1 === "day_ids") || (key1 === "specimen_ids")) || (key1 === "site_ids")) || (key1 === "kinds"))){
const err1 = {instancePath:instancePath+"/selection",schemaPath:"#/properties/selection/anyOf/0/additionalProperties",keyword:"additionalProperties",params:{additionalProperty: key1},message:"must NOT have additional properties"};
if(vErrors === null){
vErrors = [err1];
}
else {
vErrors.push(err1);
}
errors++;
break;
}
}
if(_errs13 === errors){
if(data4.day_ids !== undefined){
let data5 = data4.day_ids;
const _errs14 = errors;
if(errors === _errs14){
if(Array.isArray(data5)){
var valid4 = true;
const len0 = data5.length;
for(let i0=0; i0<len0; i0++){
let data6 = data5[i0];
const _errs16 = errors;
const _errs17 = errors;
if(errors === _errs17){
if(typeof data6 === "string"){
if(!pattern5.test(data6)){
const err2 = {instancePath:instancePath+"/selection/day_ids/" + i0,schemaPath:"#/$defs/id/pattern",keyword:"pattern",params:{pattern: "^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"},message:"must match pattern \""+"^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"+"\""};
if(vErrors === null){
vErrors = [err2];
}
else {
vErrors.push(err2);
}
errors++;
}
}
else {
const err3 = {instancePath:instancePath+"/selection/day_ids/" + i0,schemaPath:"#/$defs/id/type",keyword:"type",params:{type: "string"},message:"must be string"};
if(vErrors === null){
vErrors = [err3];
}
else {
vErrors.push(err3);
}
errors++;
}
}
var valid4 = _errs16 === errors;
if(!valid4){
break;
}
}
}
else {
const err4 = {instancePath:instancePath+"/selection/day_ids",schemaPath:"#/properties/selection/anyOf/0/properties/day_ids/type",keyword:"type",params:{type: "array"},message:"must be array"};
if(vErrors === null){
vErrors = [err4];
}
else {
vErrors.push(err4);
}
errors++;
}
}
var valid3 = _errs14 === errors;
}
else {
var valid3 = true;
}
if(valid3){
if(data4.specimen_ids !== undefined){
let data7 = data4.specimen_ids;
const _errs19 = errors;
if(errors === _errs19){
if(Array.isArray(data7)){
var valid6 = true;
const len1 = data7.length;
for(let i1=0; i1<len1; i1++){
let data8 = data7[i1];
const _errs21 = errors;
const _errs22 = errors;
if(errors === _errs22){
if(typeof data8 === "string"){
if(!pattern5.test(data8)){
const err5 = {instancePath:instancePath+"/selection/specimen_ids/" + i1,schemaPath:"#/$defs/id/pattern",keyword:"pattern",params:{pattern: "^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"},message:"must match pattern \""+"^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"+"\""};
if(vErrors === null){
vErrors = [err5];
}
else {
vErrors.push(err5);
}
errors++;
}
}
else {
const err6 = {instancePath:instancePath+"/selection/specimen_ids/" + i1,schemaPath:"#/$defs/id/type",keyword:"type",params:{type: "string"},message:"must be string"};
if(vErrors === null){
vErrors = [err6];
}
else {
vErrors.push(err6);
}
errors++;
}
}
var valid6 = _errs21 === errors;
if(!valid6){
break;
}
}
}
else {
const err7 = {instancePath:instancePath+"/selection/specimen_ids",schemaPath:"#/properties/selection/anyOf/0/properties/specimen_ids/type",keyword:"type",params:{type: "array"},message:"must be array"};
if(vErrors === null){
vErrors = [err7];
}
else {
vErrors.push(err7);
}
errors++;
}
}
var valid3 = _errs19 === errors;
}
else {
var valid3 = true;
}
if(valid3){
if(data4.site_ids !== undefined){
let data9 = data4.site_ids;
const _errs24 = errors;
if(errors === _errs24){
if(Array.isArray(data9)){
var valid8 = true;
const len2 = data9.length;
for(let i2=0; i2<len2; i2++){
let data10 = data9[i2];
const _errs26 = errors;
const _errs27 = errors;
if(errors === _errs27){
if(typeof data10 === "string"){
if(!pattern5.test(data10)){
const err8 = {instancePath:instancePath+"/selection/site_ids/" + i2,schemaPath:"#/$defs/id/pattern",keyword:"pattern",params:{pattern: "^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"},message:"must match pattern \""+"^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$"+"\""};
if(vErrors === null){
vErrors = [err8];
}
else {
vErrors.push(err8);
}
errors++;
}
}
else {
const err9 = {instancePath:instancePath+"/selection/site_ids/" + i2,schemaPath:"#/$defs/id/type",keyword:"type",params:{type: "string"},message:"must be string"};
if(vErrors === null){
vErrors = [err9];
}
else {
vErrors.push(err9);
}
errors++;
}
}
var valid8 = _errs26 === errors;
if(!valid8){
break;
}
}
}
else {
const err10 = {instancePath:instancePath+"/selection/site_ids",schemaPath:"#/properties/selection/anyOf/0/properties/site_ids/type",keyword:"type",params:{type: "array"},message:"must be array"};
if(vErrors === null){
vErrors = [err10];
}
else {
vErrors.push(err10);
}
errors++;
}
}
var valid3 = _errs24 === errors;
}
else {
var valid3 = true;
}
if(valid3){
if(data4.kinds !== undefined){
let data11 = data4.kinds;
const _errs29 = errors;
if(errors === _errs29){
if(Array.isArray(data11)){
var valid10 = true;
const len3 = data11.length;
for(let i3=0; i3<len3; i3++){
let data12 = data11[i3];
const _errs31 = errors;
if(typeof data12 !== "string"){
const err11 = {instancePath:instancePath+"/selection/kinds/" + i3,schemaPath:"#/properties/selection/anyOf/0/properties/kinds/items/type",keyword:"type",params:{type: "string"},message:"must be string"};
if(vErrors === null){
vErrors = [err11];
}
else {
vErrors.push(err11);
}
errors++;
}
if(!((((((data12 === "site") || (data12 === "specimen")) || (data12 === "day")) || (data12 === "reading")) || (data12 === "series")) || (data12 === "drop"))){
const err12 = {instancePath:instancePath+"/selection/kinds/" + i3,schemaPath:"#/properties/selection/anyOf/0/properties/kinds/items/enum",keyword:"enum",params:{allowedValues: schema31.properties.selection.anyOf[0].properties.kinds.items.enum},message:"must be equal to one of the allowed values"};
if(vErrors === null){
vErrors = [err12];
}
else {
vErrors.push(err12);
}
errors++;
}
var valid10 = _errs31 === errors;
if(!valid10){
break;
}
}
}
else {
const err13 = {instancePath:instancePath+"/selection/kinds",schemaPath:"#/properties/selection/anyOf/0/properties/kinds/type",keyword:"type",params:{type: "array"},message:"must be array"};
if(vErrors === null){
vErrors = [err13];
}
else {
vErrors.push(err13);
}
errors++;
}
}
var valid3 = _errs29 === errors;
}
else {
var valid3 = true;
}
}
}
}
}
}
}
else {
const err14 = {instancePath:instancePath+"/selection",schemaPath:"#/properties/selection/anyOf/0/type",keyword:"type",params:{type: "object"},message:"must be object"};
if(vErrors === null){
vErrors = [err14];
}
else {
vErrors.push(err14);
}
errors++;
}
}
var _valid0 = _errs11 === errors;
valid2 = valid2 || _valid0;
const _errs33 = errors;
if(data4 !== null){
const err15 = {instancePath:instancePath+"/selection",schemaPath:"#/properties/selection/anyOf/1/type",keyword:"type",params:{type: "null"},message:"must be null"};
if(vErrors === null){
vErrors = [err15];
}
else {
vErrors.push(err15);
}
errors++;
}
var _valid0 = _errs33 === errors;
valid2 = valid2 || _valid0;
if(!valid2){
const err16 = {instancePath:instancePath+"/selection",schemaPath:"#/properties/selection/anyOf",keyword:"anyOf",params:{},message:"must match a schema in anyOf"};
if(vErrors === null){
vErrors = [err16];
}
else {
vErrors.push(err16);
}
errors++;
validate20.errors = vErrors;
return false;
}
else {
errors = _errs10;
if(vErrors !== null){
if(_errs10){
vErrors.length = _errs10;
}
else {
vErrors = null;
}
}
}
var valid0 = _errs9 === errors;
}
else {
var valid0 = true;
}
if(valid0){
if(data.records !== undefined){
let data13 = data.records;
const _errs35 = errors;
if(errors === _errs35){
if(Array.isArray(data13)){
var valid11 = true;
const len4 = data13.length;
for(let i4=0; i4<len4; i4++){
const _errs37 = errors;
if(!(validate21(data13[i4], {instancePath:instancePath+"/records/" + i4,parentData:data13,parentDataProperty:i4,rootData,dynamicAnchors}))){
vErrors = vErrors === null ? validate21.errors : vErrors.concat(validate21.errors);
errors = vErrors.length;
}
var valid11 = _errs37 === errors;
if(!valid11){
break;
}
}
}
else {
validate20.errors = [{instancePath:instancePath+"/records",schemaPath:"#/properties/records/type",keyword:"type",params:{type: "array"},message:"must be array"}];
return false;
}
}
var valid0 = _errs35 === errors;
}
else {
var valid0 = true;
}
}
}
}
}
}
}
}
}
else {
validate20.errors = [{instancePath,schemaPath:"#/type",keyword:"type",params:{type: "object"},message:"must be object"}];
return false;
}
}
validate20.errors = vErrors;
return errors === 0;
}
validate20.evaluated = {"props":true,"dynamicProps":false,"dynamicItems":false};

