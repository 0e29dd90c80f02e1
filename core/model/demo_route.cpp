// The demo route (fictional team, fictional range): the same text as assets/demo-route.json
// (tests/cli/route.test.mjs compares them through `firn route --demo`).
#include "model/route_file.hpp"

namespace firn::route {

std::string_view demo_route_json() {
  return R"json({
  "schema_version": 1,
  "demo": true,
  "name": "DEMO Korvath high camp to Tarn Hut LZ",
  "start_time": "07:30",
  "casualty": {
    "spo2_on_air": "72%",
    "measured_at": "4700m",
    "exposure": "acute",
    "target_spo2": "90%",
    "device": "cannula"
  },
  "legs": [
    { "kind": "carry", "label": "up to Varn Col", "from": "4700m", "to": "4950m", "duration": "60min" },
    { "kind": "carry", "label": "down to Skorri Hut", "from": "4950m", "to": "4300m", "duration": "2h" },
    { "kind": "bag", "label": "bag at Skorri Hut", "at": "4300m", "duration": "1h",
      "oxygen_feed": "2L/min", "flush": "40L/min" },
    { "kind": "carry", "label": "down to Tarn Hut LZ", "from": "4300m", "to": "3850m", "duration": "90min" },
    { "kind": "wait", "label": "wait for the helicopter", "at": "3850m", "duration": "45min" },
    { "kind": "flight", "label": "over Brenn Ridge to the valley", "cruise": "4300m", "duration": "25min" }
  ],
  "stock": {
    "cylinders": [
      { "type": "2 L alloy", "pressure": "190bar", "temperature": "-10C" },
      { "type": "2 L alloy", "pressure": "150bar", "temperature": "-10C" },
      { "type": "3 L composite", "pressure": "280bar", "temperature": "-5C" }
    ],
    "margin": "30min",
    "count_in": "2 L alloy"
  }
}
)json";
}

}  // namespace firn::route
