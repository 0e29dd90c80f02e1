// The demo team profile, compiled in (the web page has no filesystem). DEMO DATA: the team, the
// range and the peaks are fictional. assets/demo-profile.json holds the same text (a unit test
// checks they are identical and that the text is exactly what serialize_profile writes).
#include "model/team_profile.hpp"

namespace firn::team_profile {

std::string_view demo_profile_json() {
  return R"json({
  "schema_version": 2,
  "demo": true,
  "team_name": "DEMO Skarnvald Valley Mountain Rescue",
  "units": "metric",
  "atmosphere_model": "west",
  "card": {
    "altitude_from": "1500m",
    "altitude_to": "6000m",
    "altitude_step": "250m",
    "notes": [
      "DEMO DATA: fictional team in the fictional Korvath Massif.",
      "Base hut radio: channel 4. Heli LZ above Tarn Hut (3850 m).",
      "Bag: pump to gauge, flush at the rate below, reassess each hour."
    ]
  },
  "cylinders": [
    {
      "label": "2 L alloy",
      "water_capacity": "2L",
      "fill_pressure": "200bar",
      "count": 4
    },
    {
      "label": "3 L composite",
      "water_capacity": "3L",
      "fill_pressure": "300bar",
      "count": 2
    },
    {
      "label": "E (US)",
      "size": "E",
      "fill_pressure": "2015psi",
      "count": 2
    }
  ],
  "reserve_pressure": "20bar",
  "safety_margin": {
    "minimum": "30min",
    "share": "20%"
  },
  "flows": [
    "2L/min",
    "4L/min",
    "6L/min",
    "10L/min",
    "15L/min"
  ],
  "bag": {
    "gauge_pressure": "2psi",
    "pump_stroke_volume": "3L",
    "co2_limit": "1%"
  },
  "evacuation": {
    "duration": "6h",
    "altitude": "4200m",
    "cylinders": [
      {
        "type": "2 L alloy",
        "pressure": "190bar",
        "temperature": "-10C"
      },
      {
        "type": "2 L alloy",
        "pressure": "150bar",
        "temperature": "-10C"
      },
      {
        "type": "3 L composite",
        "pressure": "280bar",
        "temperature": "-5C"
      }
    ],
    "phases": [
      {
        "flow": "15L/min",
        "duration": "1h"
      },
      {
        "flow": "6L/min"
      }
    ],
    "count_in": "2 L alloy"
  }
}
)json";
}

}  // namespace firn::team_profile
